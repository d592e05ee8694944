import { applyTestEnv } from './env';

/** Start the real server in this process on a port of its own (the test profile's services). */
export async function startTestServer(port: number) {
  applyTestEnv();
  process.env.PORT = String(port);
  process.env.HOST = '127.0.0.1';
  delete process.env.PUBLIC_URL;
  // Imported late so the environment above is in place before config is read.
  const { startServer } = await import('../../server/index');
  const started = await startServer({ seedDemo: false });
  return { ...started, url: `http://127.0.0.1:${port}` };
}
