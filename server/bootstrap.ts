import type { NextFunction, Request, Response } from 'express';
import type { Deps } from './deps';
import type { AppExtras } from './app';
import { createAuthenticate } from './middleware/authenticate';
import { csrfCheck } from './middleware/csrf';
import { demoSignInText, ensureDemoOrganisation } from './services/seed-demo';
import { reconcileQueue } from './services/queue';
import { ensureDemoNetworks } from './services/demo-networks';

/** Hooks the feature modules plug into (authentication, demo seed). */
export function serverExtras(deps: Deps): AppExtras {
  const authenticate = createAuthenticate(deps);
  return {
    // Who is calling (session or Bearer token), then the CSRF check that depends on it.
    authenticate: (req: Request, res: Response, next: NextFunction) => authenticate(req, res, (err?: unknown) => (err ? next(err) : csrfCheck(req, res, next))),
  };
}

export async function afterStart(deps: Deps, opts: { seedDemo: boolean }): Promise<void> {
  // Solve service: re-enqueue queued jobs whose queue entries were lost (Redis restart, failed enqueue).
  await reconcileQueue(deps).catch((err) => deps.logger.warn({ err }, 'solve queue not reconciled at start (Redis down?); workers reconcile when they start'));
  if (!opts.seedDemo) return;
  const demo = await ensureDemoOrganisation(deps);
  await ensureDemoNetworks(deps, demo.organisationId);
  console.log(`\n${await demoSignInText(deps)}\n`);
}
