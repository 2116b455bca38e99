import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import type { Stormdraft } from '../../server/start';
import { users } from '../../server/db/schema';
import { agentFor, demoEmail, signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
beforeAll(async () => {
  sd = await startTestApp();
});
afterAll(async () => {
  await sd?.close();
});

async function userId(email: string): Promise<string> {
  const [row] = await sd.ctx.db.select({ id: users.id }).from(users).where(eq(users.email, email));
  if (!row) throw new Error(`no user ${email}`);
  return row.id;
}

describe("issue 11 item 6: the auth library's admin endpoints are closed", () => {
  it('When an admin tries to impersonate a lead, then there is no such endpoint and no session is made', async () => {
    const admin = await signedInAgent(sd.app, 'admin');
    const leadId = await userId(demoEmail('lead'));
    const res = await admin.post('/api/auth/admin/impersonate-user').send({ userId: leadId });
    expect(res.status).toBe(404);
    const me = await admin.get('/api/me');
    expect(me.body.user.role).toBe('admin');
  });

  it.each([
    ['set-role', (id: string) => ({ userId: id, role: 'subscriber' })],
    ['remove-user', (id: string) => ({ userId: id })],
    ['set-user-password', (id: string) => ({ userId: id, newPassword: 'x' })],
    ['ban-user', (id: string) => ({ userId: id })],
    ['create-user', () => ({ email: 'x@y.test', password: 'x', name: 'x', role: 'admin' })],
    ['revoke-user-sessions', (id: string) => ({ userId: id })],
  ])('When an admin calls /api/auth/admin/%s, then it is refused with 404 and nothing changes', async (endpoint, body) => {
    const admin = await signedInAgent(sd.app, 'admin');
    const adminId = await userId(demoEmail('admin'));
    const res = await admin.post(`/api/auth/admin/${endpoint}`).send(body(adminId));
    expect(res.status).toBe(404);
    const [row] = await sd.ctx.db.select().from(users).where(eq(users.id, adminId));
    expect(row?.role).toBe('admin');
    expect(row?.banned).not.toBe(true);
  });

  it('When an admin lists users through the auth library, then it is refused (our /api/users is the way)', async () => {
    const admin = await signedInAgent(sd.app, 'admin');
    expect((await admin.get('/api/auth/admin/list-users')).status).toBe(404);
    expect((await admin.get('/api/users')).status).toBe(200);
  });

  it('When a user tries to change their own account through update-user or delete-user, then it is refused', async () => {
    const subscriber = await signedInAgent(sd.app, 'subscriber');
    expect((await subscriber.post('/api/auth/update-user').send({ name: 'Renamed' })).status).toBe(404);
    expect((await subscriber.post('/api/auth/delete-user').send({})).status).toBe(404);
    expect((await subscriber.post('/api/auth/change-password').send({ currentPassword: 'x', newPassword: 'aaaaaaaaaa' })).status).toBe(404);
  });

  it('When an admin tries to demote or disable themself through our route, then it is refused', async () => {
    const admin = await signedInAgent(sd.app, 'admin');
    const adminId = await userId(demoEmail('admin'));
    expect((await admin.patch(`/api/users/${adminId}`).send({ role: 'forecaster' })).status).toBe(403);
    expect((await admin.patch(`/api/users/${adminId}`).send({ disabled: true })).status).toBe(403);
  });

  it('When a user is disabled, then the account (and its name in history) stays, and there is no delete route', async () => {
    const admin = await signedInAgent(sd.app, 'admin');
    const created = await admin.post('/api/users').send({ name: 'Temporary Forecaster', email: 'temp@office.test', password: 'weather-balloon-at-noon', role: 'forecaster' });
    expect(created.status).toBe(201);
    expect((await admin.delete(`/api/users/${created.body.id}`)).status).toBe(404);
    expect((await admin.patch(`/api/users/${created.body.id}`).send({ disabled: true })).status).toBe(200);
    const [row] = await sd.ctx.db.select().from(users).where(eq(users.id, created.body.id));
    expect(row?.name).toBe('Temporary Forecaster');
  });

  it('When an admin creates an account with a common or one-character password, then 400 names the password field', async () => {
    const admin = await signedInAgent(sd.app, 'admin');
    for (const password of ['password123', 'aaaaaaaaaaaa', '1234567890']) {
      const res = await admin.post('/api/users').send({ name: 'Weak', email: `weak-${password.length}-${password[0]}@office.test`, password, role: 'forecaster' });
      expect(res.status, password).toBe(400);
      expect(res.body.error.issues[0].path).toBe('password');
    }
  });

  it('When the sign-in, sign-out and session endpoints the product uses are called, then they still work', async () => {
    const agent = agentFor(sd.app);
    expect((await agent.post('/api/auth/sign-in/email').send({ email: demoEmail('lead'), password: 'stormdraft-demo' })).status).toBe(200);
    expect((await agent.get('/api/auth/get-session')).status).toBe(200);
    expect((await agent.post('/api/auth/sign-out').send({})).status).toBe(200);
  });
});
