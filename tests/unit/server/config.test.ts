import { loadConfig as load, ConfigError } from '../../../server/config';

const loadConfig = (env: Record<string, string>) => load(env as NodeJS.ProcessEnv);

describe('configuration', () => {
  test('defaults give a working local setup', () => {
    const c = loadConfig({});
    expect(c.PORT).toBe(3000);
    expect(c.publicUrl).toBe('http://127.0.0.1:3000');
  });
  test('a bad value stops start-up with a message naming the variable', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(ConfigError);
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => loadConfig({ REDIS_URL: 'localhost:6379' })).toThrow(/REDIS_URL: must start with redis:\/\//);
  });
  test('production refuses the development session secret', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/);
    expect(loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'a-long-enough-real-secret', STRIPE_WEBHOOK_SECRET: 'whsec_a_real_endpoint_secret' }).NODE_ENV).toBe('production');
  });
  test('production refuses the development webhook secret (anyone could sign payment events with it)', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'a-long-enough-real-secret' })).toThrow(/STRIPE_WEBHOOK_SECRET/);
    expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'a-long-enough-real-secret', STRIPE_WEBHOOK_SECRET: 'whsec_spinyard_local_fake' })).toThrow(ConfigError);
    // Development and tests keep the local fake's secret.
    expect(loadConfig({}).STRIPE_WEBHOOK_SECRET).toBe('whsec_spinyard_local_fake');
  });
});
