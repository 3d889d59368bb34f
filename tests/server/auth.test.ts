import request from 'supertest';
import { startDemoServer, startTestServer, type DemoServer, type TestServer } from '../helpers/server';
import { SESSION_COOKIE } from '../../server/middleware/session';

describe('sign-up, sign-in and sign-out', () => {
  let s: DemoServer;
  beforeAll(async () => {
    s = await startDemoServer();
  });
  afterAll(() => s.close());

  it('signs up a new keeper, sets an HttpOnly SameSite cookie and answers /api/me', async () => {
    const agent = request.agent(s.app);
    const res = await agent.post('/api/auth/sign-up').send({ email: 'New.Keeper@Example.test', password: 'a-long-password', name: 'New Keeper' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email: 'new.keeper@example.test', name: 'New Keeper' });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toContain(`${SESSION_COOKIE}=`);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await agent.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('new.keeper@example.test');
    expect(me.body.memberships).toEqual([]);
  });

  it('refuses a second account with the same e-mail (409) and a short password (400)', async () => {
    const dup = await request(s.app).post('/api/auth/sign-up').send({ email: 'keeper@frameside.test', password: 'another-password' });
    expect(dup.status).toBe(409);
    expect(dup.body.error.message).toMatch(/already exists/);
    const short = await request(s.app).post('/api/auth/sign-up').send({ email: 'short@example.test', password: 'abc' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 10/);
  });

  it('signs in the demo keeper and lists both sites with their roles in /api/me', async () => {
    const me = await s.as.keeper.get('/api/me');
    expect(me.status).toBe(200);
    expect(me.body.memberships.map((m: { apiaryName: string; role: string }) => [m.apiaryName, m.role])).toEqual([
      ['Orchard Row', 'owner'],
      ['Quarry Hill', 'owner'],
    ]);
  });

  it('shows the sitter their window in /api/me', async () => {
    const me = await s.as.sitter.get('/api/me');
    expect(me.body.memberships).toHaveLength(1);
    expect(me.body.memberships[0]).toMatchObject({ apiaryName: 'Orchard Row', role: 'sitter' });
    expect(Date.parse(me.body.memberships[0].startsAt)).toBeLessThan(s.clock.now.getTime());
    expect(Date.parse(me.body.memberships[0].endsAt)).toBeGreaterThan(s.clock.now.getTime());
  });

  it('answers a wrong password with 401, one generic message and no cookie', async () => {
    const wrong = await request(s.app).post('/api/auth/sign-in').send({ email: 'keeper@frameside.test', password: 'not-the-password' });
    const unknown = await request(s.app).post('/api/auth/sign-in').send({ email: 'nobody@frameside.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error.message).toBe(unknown.body.error.message);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('answers 401 to /api/me when signed out', async () => {
    const res = await request(s.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthorized');
  });

  it('ends the session on sign-out, even for a copy of the old cookie', async () => {
    const agent = request.agent(s.app);
    const res = await agent.post('/api/auth/sign-in').send({ email: 'mentor@frameside.test', password: 'frameside-demo' });
    const oldCookie = String(res.headers['set-cookie']).split(';')[0]!;
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/me')).status).toBe(401);
    const replay = await request(s.app).get('/api/me').set('Cookie', oldCookie);
    expect(replay.status).toBe(401);
  });

  it('rejects malformed JSON and wrong shapes with 400 and a message', async () => {
    const bad = await request(s.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/not valid JSON/);
    const wrongType = await request(s.app).post('/api/auth/sign-in').send({ email: 42, password: null });
    expect(wrongType.status).toBe(400);
    expect(typeof wrongType.body.error.message).toBe('string');
  });

  it('reports the database in /api/health', async () => {
    const res = await request(s.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, database: 'up' });
  });
});

describe('sign-in rate limit', () => {
  let s: TestServer;
  beforeAll(async () => {
    s = await startTestServer({ signInLimit: 3 });
  });
  afterAll(() => s.close());

  it('answers 429 after too many attempts for one address and e-mail', async () => {
    const tryOnce = () => request(s.app).post('/api/auth/sign-in').send({ email: 'someone@example.test', password: 'guess-guess' });
    const statuses = [];
    for (let i = 0; i < 4; i++) statuses.push((await tryOnce()).status);
    expect(statuses).toEqual([401, 401, 401, 429]);
    const limited = await tryOnce();
    expect(limited.body.error.message).toMatch(/Too many sign-in attempts/);
  });
});
