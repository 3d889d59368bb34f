/**
 * Security basics, each held here on PostgreSQL through the real app:
 * session cookie flags, the CSRF defence (SameSite plus an Origin / Sec-Fetch-Site check),
 * the sign-in rate limit, security headers on /api and the web app, sign-out, nothing secret in
 * the logs, and uploads never public or executable.
 *
 * Sources: cookie attributes — RFC 6265 §4.1.2 (HttpOnly, Secure, Path) and the SameSite draft
 * (rfc6265bis); the Origin check — OWASP CSRF Prevention Cheat Sheet ("Verifying Origin with
 * standard headers") and the Fetch Standard (Origin header on non-GET requests); Sec-Fetch-Site —
 * W3C "Fetch Metadata Request Headers"; headers — helmet 8 defaults and the OWASP HTTP Headers
 * Cheat Sheet (nosniff, frame-ancestors, Referrer-Policy); 429 — RFC 6585 §4.
 * Also held elsewhere: 429 after repeated sign-ins and a copied cookie dying at sign-out
 * (tests/server/auth.test.ts); refused non-photo bytes (tests/server/photos-refusals.test.ts).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { Writable } from 'node:stream';
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { apiaries } from '../../db/schema';
import { seedDemo } from '../../db/seed';
import { createApp } from '../../server/app';
import { readEnv } from '../../server/env';
import { createLogger, redactUrl } from '../../server/logger';
import { SESSION_COOKIE } from '../../server/middleware/session';
import { createLocalStorage } from '../../server/storage';
import { makeJpeg } from '../helpers/images';
import { linkIn, startMailbox, tokenOf, type Mailbox } from '../helpers/mail';
import { binary, upload, waitForPhoto } from '../helpers/photo-upload';
import { startDemoServer, startTestServer, TEST_SESSION_PASSWORD, type DemoServer, type TestServer } from '../helpers/server';

jest.setTimeout(30_000);

const INDEX_HTML = '<!doctype html><html><head><title>Frameside</title></head><body><div id="root"></div></body></html>';

function makeWebDir(): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'frameside-web-'));
  fs.writeFileSync(path.join(dir, 'index.html'), INDEX_HTML);
  fs.writeFileSync(path.join(dir, 'app.js'), 'console.log("frameside");');
  return dir;
}

const apiaryCount = async (s: TestServer, name: string) => (await s.testDb.db.select().from(apiaries).where(eq(apiaries.name, name))).length;

describe('security basics', () => {
  let s: DemoServer;
  let webDir: string;
  beforeAll(async () => {
    webDir = makeWebDir();
    s = await startDemoServer({ webDir });
  });
  afterAll(async () => {
    await s.close();
    fs.rmSync(webDir, { recursive: true, force: true });
  });

  describe('session cookie', () => {
    it('is HttpOnly, SameSite=Lax, Path=/ and not Secure on plain HTTP (RFC 6265 §4.1.2, rfc6265bis SameSite)', async () => {
      const res = await request(s.app).post('/api/auth/sign-in').send({ email: 'keeper@frameside.test', password: 'frameside-demo' });
      expect(res.status).toBe(200);
      const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
      expect(cookie).toBeDefined();
      expect(cookie).toMatch(/;\s*HttpOnly/i);
      expect(cookie).toMatch(/;\s*SameSite=Lax/i);
      expect(cookie).toMatch(/;\s*Path=\/(;|$)/i);
      expect(cookie).not.toMatch(/;\s*Secure/i);
      // The cookie holds a sealed session id, not the e-mail or anything readable.
      expect(cookie).not.toContain('keeper');
    });

    it('is Secure when the app is configured for HTTPS (secureCookies), and HSTS is sent then', async () => {
      const { app } = createApp({ db: s.testDb.db, sessionPassword: TEST_SESSION_PASSWORD, secureCookies: true, signInLimit: 1000 });
      const res = await request(app).post('/api/auth/sign-in').send({ email: 'keeper@frameside.test', password: 'frameside-demo' });
      expect(res.status).toBe(200);
      const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
      expect(cookie).toMatch(/;\s*Secure/i);
      expect(cookie).toMatch(/;\s*HttpOnly/i);
      expect(cookie).toMatch(/;\s*SameSite=Lax/i);
      expect(res.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    });
  });

  describe('CSRF: writes only from the app’s own origin', () => {
    it('refuses a cookie-authenticated write from another site (Origin) with 403 and a clear message, writing nothing', async () => {
      const res = await s.as.keeper.post('/api/apiaries').set('Origin', 'https://evil.example').send({ name: 'Planted by another site' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('cross_site');
      expect(res.body.error.message).toMatch(/another website/);
      expect(await apiaryCount(s, 'Planted by another site')).toBe(0);
      for (const [method, url] of [
        ['patch', `/api/hives/${s.ids.hives.Ash}`],
        ['delete', `/api/apiaries/${s.ids.quarryHill}`],
        ['post', `/api/hives/${s.ids.hives.Ash}/inspections`],
      ] as const) {
        const r = await s.as.keeper[method](url).set('Origin', 'https://evil.example').send({});
        expect([method, url, r.status]).toEqual([method, url, 403]);
      }
      expect((await s.as.keeper.get(`/api/hives/${s.ids.hives.Ash}`)).status).toBe(200);
    });

    it('refuses sign-in from another site too (login CSRF), and Origin: null, and a look-alike host', async () => {
      const login = await request(s.app).post('/api/auth/sign-in').set('Origin', 'https://evil.example').send({ email: 'keeper@frameside.test', password: 'frameside-demo' });
      expect(login.status).toBe(403);
      expect(login.headers['set-cookie']).toBeUndefined();
      const nul = await s.as.keeper.post('/api/apiaries').set('Origin', 'null').send({ name: 'From a sandboxed frame' });
      expect(nul.status).toBe(403);
      const lookAlike = await s.as.keeper
        .post('/api/apiaries')
        .set('Host', 'frameside.example')
        .set('Origin', 'http://frameside.example.evil.example')
        .send({ name: 'Look-alike' });
      expect(lookAlike.status).toBe(403);
      const otherScheme = await s.as.keeper.post('/api/apiaries').set('Host', 'frameside.example').set('Origin', 'https://frameside.example:8443').send({ name: 'Other port' });
      expect(otherScheme.status).toBe(403);
      expect(await apiaryCount(s, 'From a sandboxed frame')).toBe(0);
    });

    it('lets a write through from the origin it was addressed to, or the configured public address', async () => {
      const own = await s.as.keeper.post('/api/apiaries').set('Host', 'frameside.example').set('Origin', 'http://frameside.example').send({ name: 'Own origin' });
      expect(own.status).toBe(201);
      // PUBLIC_URL (createApp's publicUrl; the tests' default http://127.0.0.1:8080), whatever Host a proxy passes on.
      const pub = await s.as.keeper.post('/api/apiaries').set('Host', 'internal:3000').set('Origin', 'http://127.0.0.1:8080').send({ name: 'Public address' });
      expect(pub.status).toBe(201);
    });

    it('falls back to Sec-Fetch-Site without an Origin: cross-site is refused, same-origin and none pass', async () => {
      const cross = await s.as.keeper.post('/api/apiaries').set('Sec-Fetch-Site', 'cross-site').send({ name: 'Cross-site without Origin' });
      expect(cross.status).toBe(403);
      expect(cross.body.error.message).toMatch(/another website/);
      expect(await apiaryCount(s, 'Cross-site without Origin')).toBe(0);
      const same = await s.as.keeper.post('/api/apiaries').set('Sec-Fetch-Site', 'same-origin').send({ name: 'Same origin fetch' });
      expect(same.status).toBe(201);
      // No Origin and no fetch metadata: not a browser page (curl, scripts); the session still decides.
      const bare = await s.as.keeper.post('/api/apiaries').send({ name: 'Script' });
      expect(bare.status).toBe(201);
    });

    it('leaves reads alone: a cross-site GET still answers (a GET changes nothing)', async () => {
      const res = await s.as.keeper.get('/api/me').set('Origin', 'https://evil.example').set('Sec-Fetch-Site', 'cross-site');
      expect(res.status).toBe(200);
    });

    it('lets the dev server’s origin write in `npm run dev` (devOrigin), and nothing else', async () => {
      const { app } = createApp({ db: s.testDb.db, sessionPassword: TEST_SESSION_PASSWORD, devOrigin: 'http://localhost:8081', signInLimit: 1000 });
      const agent = request.agent(app);
      const ok = await agent.post('/api/auth/sign-in').set('Origin', 'http://localhost:8081').send({ email: 'keeper@frameside.test', password: 'frameside-demo' });
      expect(ok.status).toBe(200);
      expect(ok.headers['access-control-allow-origin']).toBe('http://localhost:8081');
      const other = await agent.post('/api/apiaries').set('Origin', 'http://localhost:9999').send({ name: 'Other dev port' });
      expect(other.status).toBe(403);
    });
  });

  describe('sign-in rate limit (RFC 6585 §4: 429 Too Many Requests)', () => {
    let limited: TestServer;
    beforeAll(async () => {
      limited = await startTestServer({ signInLimit: 2 });
    });
    afterAll(() => limited.close());

    it('also covers password-reset requests, and counts each e-mail apart (one person’s typos do not lock out others)', async () => {
      const reset = () => request(limited.app).post('/api/auth/password-reset').send({ email: 'target@example.test' });
      expect([(await reset()).status, (await reset()).status, (await reset()).status]).toEqual([202, 202, 429]);
      const guess = () => request(limited.app).post('/api/auth/sign-in').send({ email: 'target@example.test', password: 'guess-guess-guess' });
      expect((await guess()).status).toBe(429);
      const other = await request(limited.app).post('/api/auth/sign-in').send({ email: 'someone-else@example.test', password: 'guess-guess-guess' });
      expect(other.status).toBe(401);
      const r = await guess();
      expect(r.body.error.message).toMatch(/Too many sign-in attempts/);
      expect(r.headers['ratelimit-policy'] ?? r.headers['ratelimit']).toBeDefined();
    });
  });

  describe('security headers (helmet; OWASP HTTP Headers Cheat Sheet)', () => {
    const expectHeaders = (res: request.Response) => {
      const csp = String(res.headers['content-security-policy']);
      expect(csp).toMatch(/default-src 'self'/);
      expect(csp).toMatch(/script-src 'self'(;|$)/);
      expect(csp).toMatch(/frame-ancestors 'self'/);
      expect(csp).toMatch(/object-src 'none'/);
      expect(csp).toMatch(/base-uri 'self'/);
      expect(res.headers['x-content-type-options']).toBe('nosniff');
      expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
      expect(res.headers['referrer-policy']).toBe('no-referrer');
      expect(res.headers['cross-origin-opener-policy']).toBe('same-origin');
      expect(res.headers['x-powered-by']).toBeUndefined();
      // Plain HTTP on loopback: no HSTS (it is sent with secureCookies, above).
      expect(res.headers['strict-transport-security']).toBeUndefined();
    };

    it('are on /api answers, errors included', async () => {
      expectHeaders(await request(s.app).get('/api/health'));
      expectHeaders(await request(s.app).get('/api/me'));
      expectHeaders(await request(s.app).get('/api/no-such-thing'));
    });

    it('are on the web app: index.html, a deep link and a static file', async () => {
      const index = await request(s.app).get('/');
      expect(index.status).toBe(200);
      expect(index.text).toContain('<div id="root">');
      expectHeaders(index);
      expectHeaders(await request(s.app).get('/hives/whatever/check'));
      const js = await request(s.app).get('/app.js');
      expect(js.status).toBe(200);
      expectHeaders(js);
    });
  });

  describe('sign-out', () => {
    it('ends the session for every copy of the cookie: a copied cookie can no longer write', async () => {
      const agent = request.agent(s.app);
      const res = await agent.post('/api/auth/sign-in').send({ email: 'cokeeper@frameside.test', password: 'frameside-demo' });
      const copied = String(res.headers['set-cookie']).split(';')[0]!;
      expect((await request(s.app).get('/api/me').set('Cookie', copied)).status).toBe(200);
      expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
      const write = await request(s.app).post('/api/apiaries').set('Cookie', copied).send({ name: 'After sign-out' });
      expect(write.status).toBe(401);
      expect(await apiaryCount(s, 'After sign-out')).toBe(0);
      // Other sessions of the same person (another phone) are not affected by this one's sign-out.
      const [cokeeperAgent] = [s.as.cokeeper];
      expect((await cokeeperAgent.get('/api/me')).status).toBe(200);
    });
  });

  describe('uploads are never public or executable', () => {
    it('the web static handler never serves the storage folder, and the app refuses to start with it inside the web folder', async () => {
      const marker = '<script>alert("stored")</script>';
      const storage = createLocalStorage(s.uploadsDir);
      await storage.put('photos/0123456789abcdef0123456789abcdef/original.jpg', Buffer.from(marker), { contentType: 'image/jpeg' });
      for (const url of [
        '/uploads/photos/0123456789abcdef0123456789abcdef/original.jpg',
        '/photos/0123456789abcdef0123456789abcdef/original.jpg',
        `/${path.basename(s.uploadsDir)}/photos/0123456789abcdef0123456789abcdef/original.jpg`,
        '/../uploads/photos/0123456789abcdef0123456789abcdef/original.jpg',
        '/_expo/../uploads/photos/0123456789abcdef0123456789abcdef/original.jpg',
      ]) {
        const res = await request(s.app).get(url);
        expect([url, res.text.includes(marker)]).toEqual([url, false]);
        if (res.status === 200) expect(res.text).toBe(INDEX_HTML);
      }
      const base = { DATABASE_URL: 'postgres://x@127.0.0.1/x', NODE_ENV: 'test' } as unknown as NodeJS.ProcessEnv;
      expect(() => readEnv({ ...base, WEB_DIR: 'dist', UPLOADS_DIR: 'dist/uploads' })).toThrow(/UPLOADS_DIR must not be inside WEB_DIR/);
      expect(() => readEnv({ ...base, WEB_DIR: 'dist', UPLOADS_DIR: 'dist' })).toThrow(/UPLOADS_DIR must not be inside WEB_DIR/);
      expect(readEnv({ ...base, WEB_DIR: 'dist', UPLOADS_DIR: 'uploads' }).UPLOADS_DIR).toBe('uploads');
    });

    it('a photo goes out only through the access-checked route, as image/jpeg with nosniff and a sandbox CSP', async () => {
      const ash = s.ids.hives.Ash!;
      const up = await upload(s.as.keeper, ash, [{ buf: makeJpeg(64, 48), name: 'frame.html' }]);
      expect(up.status).toBe(202);
      const ready = await waitForPhoto(s.as.keeper, ash, up.body.photos[0].id);
      expect(ready.status).toBe('ready');
      for (const size of ['thumb', 'display', 'original']) {
        const res = await s.as.keeper.get(`/api/photos/${ready.id}?size=${size}`).buffer(true).parse(binary);
        expect(res.status).toBe(200);
        expect(res.headers['content-type']).toBe('image/jpeg');
        expect(res.headers['x-content-type-options']).toBe('nosniff');
        expect(res.headers['content-security-policy']).toMatch(/default-src 'none'; sandbox/);
        expect(res.headers['cache-control']).toMatch(/^private/);
        expect(String(res.headers['content-disposition'])).not.toMatch(/html/);
        expect((res.body as Buffer).subarray(0, 3).toString('hex')).toBe('ffd8ff');
      }
      expect((await request(s.app).get(`/api/photos/${ready.id}`)).status).toBe(401);
      expect((await s.as.stranger.get(`/api/photos/${ready.id}`)).status).toBe(404);
    });
  });
});

describe('passwords and tokens never reach the logs', () => {
  let s: TestServer;
  let mail: Mailbox;
  let lines: string[];
  let app: ReturnType<typeof createApp>['app'];
  beforeAll(async () => {
    s = await startTestServer();
    await seedDemo(s.testDb.db, { now: new Date() });
    mail = await startMailbox();
    lines = [];
    const sink = new Writable({
      write(chunk, _enc, cb) {
        lines.push(String(chunk));
        cb();
      },
    });
    ({ app } = createApp({
      db: s.testDb.db,
      sessionPassword: TEST_SESSION_PASSWORD,
      logger: createLogger('trace', sink),
      mailer: mail.mailer,
      signInLimit: 1000,
      storage: createLocalStorage(s.uploadsDir),
    }));
  });
  afterAll(async () => {
    await mail.close();
    await s.close();
  });

  it('logs each request of sign-up, sign-in, an invitation accepted and a password reset, with no password, token or cookie in them', async () => {
    const secrets: string[] = [];
    const ownerPassword = 'owner-secret-Pa55word-1';
    const owner = request.agent(app);
    const su = await owner.post('/api/auth/sign-up').send({ email: 'owner@example.test', password: ownerPassword, name: 'Owner' });
    expect(su.status).toBe(201);
    secrets.push(ownerPassword);
    const cookieValue = String(su.headers['set-cookie']).split(';')[0]!.split('=')[1]!;
    secrets.push(cookieValue);

    const signIn = await request(app).post('/api/auth/sign-in').send({ email: 'owner@example.test', password: ownerPassword });
    expect(signIn.status).toBe(200);
    // A failed sign-in with a typo'd password is not logged either.
    const typo = 'owner-secret-Pa55word-2-typo';
    expect((await request(app).post('/api/auth/sign-in').send({ email: 'owner@example.test', password: typo })).status).toBe(401);
    secrets.push(typo);

    const apiary = await owner.post('/api/apiaries').send({ name: 'Log test site' });
    expect(apiary.status).toBe(201);
    const inv = await owner.post(`/api/apiaries/${apiary.body.apiary.id}/invitations`).send({ email: 'helper@example.test', role: 'keeper' });
    expect(inv.status).toBe(201);
    const inviteToken = tokenOf(linkIn(await mail.waitFor('helper@example.test', /Invitation/), '/invite/'));
    secrets.push(inviteToken);
    expect((await request(app).get(`/api/invitations/${inviteToken}`)).status).toBe(200);
    const helperPassword = 'helper-secret-Pa55word-3';
    const acc = await request(app).post(`/api/invitations/${inviteToken}/accept`).send({ email: 'helper@example.test', password: helperPassword, name: 'Helper' });
    expect(acc.status).toBe(200);
    secrets.push(helperPassword);

    expect((await request(app).post('/api/auth/password-reset').send({ email: 'owner@example.test' })).status).toBe(202);
    const resetToken = tokenOf(linkIn(await mail.waitFor('owner@example.test', /Reset your Frameside password/), '/reset-password/'));
    secrets.push(resetToken);
    const newPassword = 'owner-new-secret-Pa55word-4';
    expect((await request(app).post(`/api/auth/password-reset/${resetToken}`).send({ password: newPassword })).status).toBe(204);
    secrets.push(newPassword);
    // A bad request that fails validation, with the password in the body, is not logged with it.
    const badBody = 'bad-body-secret-Pa55word-5';
    expect((await request(app).post('/api/auth/sign-up').send({ email: 'not an e-mail', password: badBody })).status).toBe(400);
    secrets.push(badBody);

    await new Promise((r) => setTimeout(r, 50));
    const log = lines.join('');
    // The requests were logged (so the check below means something), with the tokens masked.
    expect(log).toContain('/api/auth/sign-up');
    expect(log).toContain('/api/invitations/[redacted]/accept');
    expect(log).toContain('/api/auth/password-reset/[redacted]');
    expect(log).toContain('[redacted]');
    for (const secret of secrets) expect([secret.slice(0, 12), log.includes(secret)]).toEqual([secret.slice(0, 12), false]);
    // Nor the stored hashes.
    expect(log).not.toMatch(/scrypt|\$argon2/);
  });

  it('masks link tokens in any logged address', () => {
    const t = 'A'.repeat(21) + '_-' + 'b'.repeat(20);
    expect(redactUrl(`/api/invitations/${t}`)).toBe('/api/invitations/[redacted]');
    expect(redactUrl(`/api/auth/password-reset/${t}?x=1`)).toBe('/api/auth/password-reset/[redacted]?x=1');
    expect(redactUrl(`/api/x?token=${t}&a=b`)).toBe('/api/x?token=[redacted]&a=b');
    // UUIDs (36 characters) stay readable.
    expect(redactUrl('/api/hives/0b0c6a9e-8f4e-4c38-9d55-1a2b3c4d5e6f')).toBe('/api/hives/0b0c6a9e-8f4e-4c38-9d55-1a2b3c4d5e6f');
  });
});
