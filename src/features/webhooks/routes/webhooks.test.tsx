// @vitest-environment jsdom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { fakeServer, renderApp } from '../../../test/render-app';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const endpoint = { id: '11111111-1111-4111-8111-111111111111', url: 'https://alerts.example.org/hook', description: 'County hub', active: true, ownerEmail: 'subscriber@demo.stormdraft.test', createdAt: '2027-04-18T12:00:00.000Z' };
const secret = 'whsec_c2VjcmV0LXNob3duLW9uY2UtYW5kLW5ldmVyLWFnYWlu';

describe('webhooks page', () => {
  it('when a subscriber registers an endpoint, shows its secret once and lists it; the delivery log opens on demand', async () => {
    let endpoints: (typeof endpoint)[] = [];
    const server = fakeServer({
      role: 'subscriber',
      routes: [
        ({ method, path }) => {
          if (path === '/api/webhook-endpoints' && method === 'GET') return { status: 200, body: { endpoints } };
          if (path === '/api/webhook-endpoints' && method === 'POST') {
            endpoints = [endpoint];
            return { status: 201, body: { endpoint, secret } };
          }
          if (path === `/api/webhook-endpoints/${endpoint.id}/deliveries`) {
            return { status: 200, body: { deliveries: [{ id: 'd1', eventType: 'issuance.published', issuanceNumber: '2027-0142', messageId: 'msg_abc', status: 'delivered', attempts: 2, lastStatusCode: 200, lastError: null, nextAttemptAt: '2027-04-18T12:00:00.000Z', deliveredAt: '2027-04-18T12:01:00.000Z', createdAt: '2027-04-18T12:00:00.000Z' }] } };
          }
          return undefined;
        },
      ],
    });
    renderApp('/webhooks');
    expect(await screen.findByText('No endpoints yet.')).not.toBeNull();
    fireEvent.change(screen.getByLabelText('Endpoint address'), { target: { value: endpoint.url } });
    fireEvent.change(screen.getByLabelText('Description'), { target: { value: 'County hub' } });
    fireEvent.click(screen.getByRole('button', { name: 'Register endpoint' }));

    expect((await screen.findByLabelText('Signing secret')).textContent).toBe(secret);
    expect(server.requests.find((r) => r.method === 'POST')?.body).toEqual({ url: endpoint.url, description: 'County hub' });
    expect(await screen.findByText(endpoint.url)).not.toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'I have stored it' }));
    expect(screen.queryByLabelText('Signing secret')).toBeNull();

    fireEvent.click(screen.getByRole('button', { name: 'Delivery log' }));
    const log = await screen.findByRole('table', { name: 'Delivery log' });
    expect(within(log).getByText('msg_abc')).not.toBeNull();
    expect(within(log).getByText('Delivered')).not.toBeNull();
  });

  it('when the address is not a URL, says so beside the field without calling the server', async () => {
    const server = fakeServer({ role: 'admin', routes: [({ method, path }) => (path === '/api/webhook-endpoints' && method === 'GET' ? { status: 200, body: { endpoints: [] } } : undefined)] });
    renderApp('/webhooks');
    fireEvent.change(await screen.findByLabelText('Endpoint address'), { target: { value: 'alerts' } });
    fireEvent.click(screen.getByRole('button', { name: 'Register endpoint' }));
    expect(await screen.findByText(/Enter a full address/)).not.toBeNull();
    expect(server.requests.some((r) => r.method === 'POST')).toBe(false);
  });

  it('when a delivery failed, its Retry button asks the server to queue it again', async () => {
    const failed = { id: '22222222-2222-4222-8222-222222222222', eventType: 'issuance.amended', issuanceNumber: '2027-0143', messageId: 'msg_def', status: 'failed', attempts: 8, lastStatusCode: 503, lastError: 'The endpoint answered HTTP 503.', nextAttemptAt: '2027-04-18T13:00:00.000Z', deliveredAt: null, createdAt: '2027-04-18T12:00:00.000Z' };
    const server = fakeServer({
      role: 'subscriber',
      routes: [
        ({ method, path }) => {
          if (path === '/api/webhook-endpoints' && method === 'GET') return { status: 200, body: { endpoints: [endpoint] } };
          if (path === `/api/webhook-endpoints/${endpoint.id}/deliveries`) return { status: 200, body: { deliveries: [failed] } };
          if (path === `/api/webhook-deliveries/${failed.id}/retry` && method === 'POST') return { status: 200, body: { id: failed.id, status: 'queued' } };
          return undefined;
        },
      ],
    });
    renderApp('/webhooks');
    fireEvent.click(await screen.findByRole('button', { name: 'Delivery log' }));
    const log = await screen.findByRole('table', { name: 'Delivery log' });
    expect(within(log).getByText('The endpoint answered HTTP 503.')).not.toBeNull();
    fireEvent.click(within(log).getByRole('button', { name: 'Retry' }));
    await waitFor(() => expect(server.requests.some((r) => r.method === 'POST' && r.path === `/api/webhook-deliveries/${failed.id}/retry`)).toBe(true));
  });
});
