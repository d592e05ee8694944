import { z } from 'zod';

/**
 * The web app runs under a CSP without 'unsafe-eval' (server/app.ts). zod 4 probes for eval with
 * `new Function("")` on its first object parse; the probe is caught, but the browser still reports
 * a CSP violation. Jitless mode skips the probe (same results, interpreted parsing).
 */
z.config({ jitless: true });
