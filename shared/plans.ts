/**
 * Plans and their seat limits — the one place for them (the billing feature adds prices here).
 * Seats in use = members + pending (unexpired) invitations.
 */
export const PLAN_IDS = ['free', 'team', 'fleet'] as const;
export type PlanId = (typeof PLAN_IDS)[number];

export interface PlanLimits {
  id: PlanId;
  label: string;
  seats: number;
}

export const PLANS: Record<PlanId, PlanLimits> = {
  free: { id: 'free', label: 'Free', seats: 3 },
  team: { id: 'team', label: 'Team', seats: 10 },
  fleet: { id: 'fleet', label: 'Fleet', seats: 50 },
};

export const DEFAULT_PLAN: PlanId = 'free';

/** Seat limit of a plan; unknown plan names fall back to the free plan (never more seats by mistake). */
export function seatLimit(plan: string | null | undefined): number {
  return (PLANS[plan as PlanId] ?? PLANS[DEFAULT_PLAN]).seats;
}

export function planLabel(plan: string | null | undefined): string {
  return (PLANS[plan as PlanId] ?? PLANS[DEFAULT_PLAN]).label;
}

/**
 * Run limits per plan (solve service): the largest network a run may use, the most qubits a
 * variational solver may simulate directly, the longest time per solver, and the queue priority
 * (BullMQ: lower number runs first — paid plans go ahead of free ones).
 */
export interface PlanRunLimits {
  maxDepots: number;
  maxQubits: number;
  maxSecondsPerSolver: number;
  /** Runs that may be queued or running at once in one organisation. */
  maxActiveRuns: number;
  priority: number;
}

export const RUN_LIMITS: Record<PlanId, PlanRunLimits> = {
  free: { maxDepots: 200, maxQubits: 16, maxSecondsPerSolver: 60, maxActiveRuns: 30, priority: 10 },
  team: { maxDepots: 2000, maxQubits: 22, maxSecondsPerSolver: 600, maxActiveRuns: 100, priority: 3 },
  fleet: { maxDepots: 20000, maxQubits: 24, maxSecondsPerSolver: 3600, maxActiveRuns: 400, priority: 1 },
};

/** Run limits of a plan; unknown plan names get the free plan's (never more by mistake). */
export function runLimits(plan: string | null | undefined): PlanRunLimits {
  return RUN_LIMITS[plan as PlanId] ?? RUN_LIMITS[DEFAULT_PLAN];
}

/** The next plan up (what to suggest when a run is over the limits), or null at the top. */
export function nextPlan(plan: string | null | undefined): PlanId | null {
  const i = PLAN_IDS.indexOf((PLANS[plan as PlanId] ? plan : DEFAULT_PLAN) as PlanId);
  return i >= 0 && i < PLAN_IDS.length - 1 ? PLAN_IDS[i + 1] : null;
}
