/**
 * Text limits of a depot, shared by the API schemas (shared/schemas/networks.ts) and the
 * import checks (checkNetwork), so a network that imports can also be edited and saved.
 */
export const DEPOT_ID_MAX = 120;
export const DEPOT_NAME_MAX = 200;
