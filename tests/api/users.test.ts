import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type TestAgent from 'supertest/lib/agent';
import type { Stormdraft } from '../../server/start';
import { agentFor, signedInAgent, startTestApp } from './helpers/test-app';

let sd: Stormdraft;
let admin: TestAgent;
beforeAll(async () => {
  sd = await startTestApp();
  admin = await signedInAgent(sd.app, 'admin');
});
afterAll(async () => {
  await sd?.close();
});

describe('POST /api/users', () => {
  it('When an admin creates a forecaster, then that person can sign in with the forecaster role', async () => {
    const res = await admin.post('/api/users').send({ name: 'Nia Nights', email: 'Nia@Office.test', password: 'night-shift-pass', role: 'forecaster' });
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ email: 'nia@office.test', role: 'forecaster', disabled: false });
    const agent = agentFor(sd.app);
    expect((await agent.post('/api/auth/sign-in/email').send({ email: 'nia@office.test', password: 'night-shift-pass' })).status).toBe(200);
    expect((await agent.get('/api/me')).body.user.role).toBe('forecaster');
  });

  it('When the e-mail is taken, then 409 names the field', async () => {
    const res = await admin.post('/api/users').send({ name: 'Dup', email: 'lead@demo.stormdraft.test', password: 'long-enough-1', role: 'lead' });
    expect(res.status).toBe(409);
    expect(res.body.error.issues[0].path).toBe('email');
  });

  it('When the role is unknown, then 400 names the role field', async () => {
    const res = await admin.post('/api/users').send({ name: 'Odd', email: 'odd@office.test', password: 'long-enough-1', role: 'chief' });
    expect(res.status).toBe(400);
    expect(res.body.error.issues.map((i: { path: string }) => i.path)).toContain('role');
  });
});

describe('PATCH /api/users/:userId', () => {
  async function userId(email: string): Promise<string> {
    const list = await admin.get('/api/users');
    const found = list.body.users.find((u: { email: string }) => u.email === email);
    if (!found) throw new Error(`no user ${email}`);
    return found.id;
  }

  it('When an admin promotes a forecaster to lead, then the existing session sees the new role', async () => {
    await admin.post('/api/users').send({ name: 'Promo', email: 'promo@office.test', password: 'long-enough-1', role: 'forecaster' });
    const person = agentFor(sd.app);
    await person.post('/api/auth/sign-in/email').send({ email: 'promo@office.test', password: 'long-enough-1' });
    const res = await admin.patch(`/api/users/${await userId('promo@office.test')}`).send({ role: 'lead' });
    expect(res.status).toBe(200);
    expect((await person.get('/api/me')).body.user.role).toBe('lead');
  });

  it('When an admin disables a user, then their session ends and they cannot sign in again', async () => {
    await admin.post('/api/users').send({ name: 'Gone', email: 'gone@office.test', password: 'long-enough-1', role: 'forecaster' });
    const person = agentFor(sd.app);
    await person.post('/api/auth/sign-in/email').send({ email: 'gone@office.test', password: 'long-enough-1' });
    expect((await person.get('/api/me')).status).toBe(200);
    const res = await admin.patch(`/api/users/${await userId('gone@office.test')}`).send({ disabled: true });
    expect(res.status).toBe(200);
    expect(res.body.disabled).toBe(true);
    expect((await person.get('/api/me')).status).toBe(401);
    const again = await agentFor(sd.app).post('/api/auth/sign-in/email').send({ email: 'gone@office.test', password: 'long-enough-1' });
    expect(again.status).not.toBe(200);
  });

  it('When an admin tries to disable themselves, then 403 explains why', async () => {
    const res = await admin.patch(`/api/users/${await userId('admin@demo.stormdraft.test')}`).send({ disabled: true });
    expect(res.status).toBe(403);
  });

  it('When the user does not exist, then 404', async () => {
    const res = await admin.patch('/api/users/no-such-user').send({ role: 'lead' });
    expect(res.status).toBe(404);
  });
});

describe('PUT /api/me/preferences', () => {
  it('When a user saves units, then /api/me returns them', async () => {
    const agent = await signedInAgent(sd.app, 'subscriber');
    const units = { temperature: 'F', height: 'ft', speed: 'mph' };
    expect((await agent.put('/api/me/preferences').send({ units })).status).toBe(200);
    expect((await agent.get('/api/me')).body.preferences.units).toEqual(units);
  });

  it('When a unit is unknown, then 400 names the field', async () => {
    const agent = await signedInAgent(sd.app, 'subscriber');
    const res = await agent.put('/api/me/preferences').send({ units: { temperature: 'K', height: 'm', speed: 'kt' } });
    expect(res.status).toBe(400);
    expect(res.body.error.issues[0].path).toBe('units.temperature');
  });
});
