/**
 * Test environment defaults: the private "test" profile that `npm test` starts
 * (server/scripts/services.sh). Running a suite by hand needs those services up too:
 *   bash -c 'source server/scripts/services.sh; profile_env test; start_mariadb; start_redis'
 */
export function applyTestEnv(): void {
  const defaults: Record<string, string> = {
    NODE_ENV: 'test',
    DB_HOST: '127.0.0.1',
    DB_PORT: '3317',
    DB_NAME: 'spinyard_test',
    DB_USER: 'spinyard',
    DB_PASSWORD: 'spinyard-local',
    REDIS_URL: 'redis://127.0.0.1:6391',
    SMTP_PORT: '1026',
    SESSION_SECRET: 'spinyard-test-session-secret-0123456789',
  };
  for (const [k, v] of Object.entries(defaults)) process.env[k] ??= v;
  process.env.NODE_ENV = 'test';
}
