import request from 'supertest';
import { applyTestEnv } from '../support/env';
import { loadConfig } from '../../server/config';
import { createDeps, closeDeps, type Deps } from '../../server/deps';
import { createApp } from '../../server/app';

applyTestEnv();

const disposers: Array<() => void> = [];
afterAll(() => disposers.forEach((d) => d()));

describe('GET /api/health', () => {
  let deps: Deps;
  afterEach(async () => {
    if (deps) await closeDeps(deps);
  });

  test('reports db and queue up against the real MariaDB and Redis', async () => {
    deps = createDeps(loadConfig());
    const { app, dispose } = createApp(deps);
    disposers.push(dispose);
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up', queue: 'up', version: expect.stringMatching(/^\d+\.\d+\.\d+/) });
  });

  test('answers 503 and names the part that is down when Redis cannot be reached', async () => {
    deps = createDeps(loadConfig({ ...process.env, REDIS_URL: 'redis://127.0.0.1:1' }));
    const { app, dispose } = createApp(deps);
    disposers.push(dispose);
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toMatchObject({ status: 'degraded', db: 'up', queue: 'down' });
  });

  test('answers 503 with db down when MariaDB cannot be reached', async () => {
    deps = createDeps(loadConfig({ ...process.env, DB_PORT: '1' }));
    const { app, dispose } = createApp(deps);
    disposers.push(dispose);
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body).toMatchObject({ db: 'down', queue: 'up' });
  });
});

describe('web app serving', () => {
  let deps: Deps;
  afterAll(async () => closeDeps(deps));
  test('unknown API paths get a JSON 404; app paths get the single-page app with a strict CSP', async () => {
    deps = createDeps(loadConfig());
    const { app, dispose } = createApp(deps);
    disposers.push(dispose);
    const api = await request(app).get('/api/no-such-thing');
    expect(api.status).toBe(404);
    expect(api.body.error).toMatch(/No such API route/);
    const page = await request(app).get('/networks/123');
    expect([200, 503]).toContain(page.status); // 503 only when the web build is missing
    if (page.status === 200) expect(page.text).toContain('<div id="root">');
    expect(page.headers['content-security-policy']).toContain("script-src 'self'");
  });
});
