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

/**
 * Seat limit of a plan plus seats bought on top (billing); unknown plan names fall back to the
 * free plan (never more seats by mistake).
 */
export function seatLimit(plan: string | null | undefined, purchasedSeats = 0): number {
  return (PLANS[plan as PlanId] ?? PLANS[DEFAULT_PLAN]).seats + Math.max(0, Math.floor(purchasedSeats));
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

/* ------------------------------------------------------------------------------------------ *
 * Prices (billing). Amounts are integers in the currency's smallest unit (cents).
 * A run inside its plan's included size is free (up to the monthly allowance of runs); a larger
 * run — up to the paid ceiling — is priced per solve and held until it is paid.
 * ------------------------------------------------------------------------------------------ */

export const CURRENCY = 'eur';

export interface Price {
  /** Integer, smallest currency unit (cents). */
  amount: number;
  currency: string;
}

export interface PlanPrices {
  /** Runs per calendar month that cost nothing while inside the included size. */
  monthlyFreeRuns: number;
  /** A run inside the included size after the allowance is used up. */
  smallRun: number;
  /** Every large run pays this, plus the size surcharges below. */
  largeRunBase: number;
  /** Per started 100 depots above the plan's included depots (classical work grows with size). */
  per100DepotsOver: number;
  /** A variational solver above the included qubits pays this × (2^extra − 1): statevector memory and time double per qubit. */
  perQubitDoubling: number;
  /** Per started minute of solver time above the plan's included seconds, per solver. */
  perExtraMinute: number;
  /** Price of one extra seat (one-off purchase, adds one to the seat limit). */
  seat: number;
}

export const PRICES: Record<PlanId, PlanPrices> = {
  free: { monthlyFreeRuns: 200, smallRun: 50, largeRunBase: 200, per100DepotsOver: 50, perQubitDoubling: 25, perExtraMinute: 10, seat: 900 },
  team: { monthlyFreeRuns: 1000, smallRun: 20, largeRunBase: 150, per100DepotsOver: 30, perQubitDoubling: 15, perExtraMinute: 5, seat: 700 },
  fleet: { monthlyFreeRuns: 10000, smallRun: 10, largeRunBase: 100, per100DepotsOver: 20, perQubitDoubling: 10, perExtraMinute: 3, seat: 500 },
};

/** Credit packs an admin can buy (cents). */
export const CREDIT_PACKS = [1000, 2500, 10000] as const;

/** The plan whose run limits bound a paid run: the next plan up (the top plan's own). */
export function paidRunPlan(plan: string | null | undefined): PlanId {
  return nextPlan(plan) ?? ((PLANS[plan as PlanId] ? plan : DEFAULT_PLAN) as PlanId);
}

export function planPrices(plan: string | null | undefined): PlanPrices {
  return PRICES[plan as PlanId] ?? PRICES[DEFAULT_PLAN];
}

/** What a price depends on: the network size and, per solver, its family, qubits and time. */
export interface RunSize {
  depots: number;
  /** Seconds each solver may use. */
  secondsPerSolver: number;
  /** Per solver: its family and the qubits it says it will simulate (SolverDefinition.qubits; 0 classical). */
  solvers: ReadonlyArray<{ name?: string; family: string; qubits: number | null }>;
  /** Runs the organisation already started this calendar month (for the allowance). */
  runsThisMonth?: number;
}

export interface RunPriceLine {
  label: string;
  amount: number;
}

export interface RunPrice extends Price {
  lines: RunPriceLine[];
}

/** Why a run of this size cannot start on this plan, even paid (the check runs before any price). */
export interface RunSizeRefusal {
  limit: 'depots' | 'seconds' | 'qubits';
  /** The plan whose limits were exceeded (the paid ceiling: the next plan up). */
  plan: PlanId;
  message: string;
}

/** Surcharge in cents for one variational solver simulating `extra` qubits above the plan's included ones (memory and time double per qubit). */
export function extraQubitCharge(plan: string | null | undefined, extra: number): number {
  return extra > 0 ? planPrices(plan).perQubitDoubling * (2 ** extra - 1) : 0;
}

/**
 * The one size rule: a run may go up to the paid ceiling's limits (paidRunPlan) — depots, seconds
 * per solver, and the qubits each variational solver says it will simulate. Beyond them it is
 * refused before launch, never priced.
 */
export function runSizeRefusal(plan: string | null | undefined, size: RunSize): RunSizeRefusal | null {
  const ceiling = paidRunPlan(plan);
  const limits = runLimits(ceiling);
  const label = planLabel(ceiling);
  const up = nextPlan(plan) === ceiling ? ` (a paid run on the ${planLabel(plan)} plan may go up to the ${label} plan's limits)` : '';
  if (size.depots > limits.maxDepots) {
    return { limit: 'depots', plan: ceiling, message: `The ${label} plan runs networks of up to ${limits.maxDepots} depots${up}; this one has ${size.depots}.` };
  }
  if (size.secondsPerSolver > limits.maxSecondsPerSolver) {
    return { limit: 'seconds', plan: ceiling, message: `The ${label} plan gives each solver at most ${limits.maxSecondsPerSolver} s${up}; ${size.secondsPerSolver} s were asked for.` };
  }
  for (const [i, s] of size.solvers.entries()) {
    if (s.family === 'variational' && s.qubits !== null && s.qubits > limits.maxQubits) {
      return { limit: 'qubits', plan: ceiling, message: `${s.name ?? `Solver ${i + 1}`} would simulate ${s.qubits} qubits; the ${label} plan allows ${limits.maxQubits}${up}. Try the decomposition solver (qaoa-blocks) or a classical one.` };
    }
  }
  return null;
}

/** Most solvers a price ceiling is stated for (the run schema's own limit is lower). */
export const PRICED_SOLVERS_MAX = 20;

/**
 * The most a run can cost on this plan: the price of the largest run the paid ceiling allows
 * (its depots and seconds, PRICED_SOLVERS_MAX variational solvers at its qubit limit). Every quote
 * is at most this; runs beyond the ceiling are refused instead (runSizeRefusal).
 */
export function runPriceCeiling(plan: string | null | undefined): number {
  const top = runLimits(paidRunPlan(plan));
  const solvers = Array.from({ length: PRICED_SOLVERS_MAX }, () => ({ family: 'variational', qubits: top.maxQubits }));
  return priceOfRun(plan, { depots: top.maxDepots, secondsPerSolver: top.maxSecondsPerSolver, solvers, runsThisMonth: Infinity })?.amount ?? 0;
}

/**
 * Price of one run, or null when it is free. The one pricing rule: the API stores it with the
 * run and the run-setup screen shows the same number. A size beyond the paid ceiling has no
 * price: callers check runSizeRefusal first, and this throws rather than quote it.
 */
export function priceOfRun(plan: string | null | undefined, size: RunSize): RunPrice | null {
  const refusal = runSizeRefusal(plan, size);
  if (refusal) throw new RangeError(`no price for a run beyond the plan's ceiling: ${refusal.message}`);
  const included = runLimits(plan);
  const p = planPrices(plan);
  const lines: RunPriceLine[] = [];
  const overDepots = Math.max(0, size.depots - included.maxDepots);
  const overSeconds = Math.max(0, size.secondsPerSolver - included.maxSecondsPerSolver);
  const extraQubits = size.solvers.map((s) => (s.family === 'variational' && s.qubits !== null ? Math.max(0, s.qubits - included.maxQubits) : 0));
  const large = overDepots > 0 || overSeconds > 0 || extraQubits.some((q) => q > 0);
  if (!large) {
    if ((size.runsThisMonth ?? 0) < p.monthlyFreeRuns) return null;
    return { amount: p.smallRun, currency: CURRENCY, lines: [{ label: `Run beyond the ${p.monthlyFreeRuns} included this month`, amount: p.smallRun }] };
  }
  lines.push({ label: 'Large solve', amount: p.largeRunBase });
  if (overDepots > 0) lines.push({ label: `${overDepots} depots above ${included.maxDepots}`, amount: Math.ceil(overDepots / 100) * p.per100DepotsOver });
  extraQubits.forEach((extra, i) => {
    if (extra > 0) lines.push({ label: `Solver ${i + 1}: ${extra} qubits above ${included.maxQubits}`, amount: extraQubitCharge(plan, extra) });
  });
  if (overSeconds > 0) lines.push({ label: `${size.solvers.length} solver(s) × ${overSeconds} s above ${included.maxSecondsPerSolver} s`, amount: Math.ceil(overSeconds / 60) * p.perExtraMinute * size.solvers.length });
  return { amount: lines.reduce((s, l) => s + l.amount, 0), currency: CURRENCY, lines };
}

/** "€12.50" — amounts are cents. */
export function formatMoney(price: Price): string {
  const symbol = price.currency.toLowerCase() === 'eur' ? '€' : `${price.currency.toUpperCase()} `;
  // Thousands grouped (€39,322.95), two decimals — large-solve quotes can run to five figures.
  return `${symbol}${(price.amount / 100).toLocaleString('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 })}`;
}
