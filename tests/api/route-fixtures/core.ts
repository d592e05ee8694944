import type { OpenRoutes } from './types';

/** Open routes of the foundation and of integrations that authenticate themselves. */
export const openRoutes: OpenRoutes = {
  'GET /health': 'service state for probes; no organisation data',
  'GET /openapi.json': 'the route list itself',
  'POST /billing/webhook': 'called by the payment provider; checks its own signature, no session or CSRF',
};
