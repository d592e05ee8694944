import type { Server } from 'node:http';
import { loadConfig, ConfigError } from './config';
import { createDeps, closeDeps, type Deps } from './deps';
import { createApp } from './app';
import { migrate } from './migrate';
import { databaseUp } from './db';
import { serverExtras, afterStart } from './bootstrap';
import { billingRunHooks } from './services/billing-run-hooks';

/** Start the API server: validate config, wait for MariaDB, migrate, listen; stop cleanly on signals. */
export async function startServer(opts: { seedDemo?: boolean } = {}): Promise<{ server: Server; deps: Deps; stop: () => Promise<void> }> {
  const config = loadConfig();
  const deps = createDeps(config, { runHooks: billingRunHooks });
  const deadline = Date.now() + 20000;
  while (!(await databaseUp(deps.db))) {
    if (Date.now() > deadline) {
      await closeDeps(deps);
      throw new ConfigError(`MariaDB at ${config.DB_HOST}:${config.DB_PORT} did not answer within 20 s; start it (npm start does) or fix DB_HOST/DB_PORT`);
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  const applied = await migrate(deps.db);
  if (applied.length) deps.logger.info({ applied }, 'migrations applied');
  const { app, dispose } = createApp(deps, serverExtras(deps));
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
    s.on('error', (err: NodeJS.ErrnoException) =>
      reject(err.code === 'EADDRINUSE' ? new ConfigError(`port ${config.PORT} is in use; stop the other program or set PORT`) : err),
    );
  });
  await afterStart(deps, { seedDemo: !!opts.seedDemo });
  const stop = async () => {
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections?.();
    await closed;
    dispose();
    await closeDeps(deps);
  };
  return { server, deps, stop };
}

if (require.main === module) {
  startServer({ seedDemo: process.argv.includes('--seed-demo') })
    .then(({ deps, stop }) => {
      deps.logger.info({ url: deps.config.publicUrl }, 'Spinyard is listening');
      console.log(`\n  Spinyard is up: ${deps.config.publicUrl}\n`);
      let stopping = false;
      const shutdown = (signal: string) => {
        if (stopping) return;
        stopping = true;
        deps.logger.info({ signal }, 'shutting down');
        const force = setTimeout(() => process.exit(1), 10000);
        force.unref();
        stop().then(() => process.exit(0), () => process.exit(1));
      };
      process.on('SIGINT', () => shutdown('SIGINT'));
      process.on('SIGTERM', () => shutdown('SIGTERM'));
    })
    .catch((err) => {
      console.error(`spinyard: ${err instanceof ConfigError ? err.message : err?.stack ?? err}`);
      process.exit(err instanceof ConfigError ? 2 : 1);
    });
}
