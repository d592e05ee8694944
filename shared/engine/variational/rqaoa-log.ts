/**
 * The per-round log of recursive QAOA as a run keeps it: what each round imposed (depots
 * eliminated, the strongest and weakest |correlation| it used, how many went to the same side and
 * how many to the other), compact enough to store with a result at any size. A 20,000-depot
 * network takes ~700 rounds at the default batching; above `cap` entries, consecutive rounds are
 * merged into equal groups (`from`…`to`), so the log never holds more than `cap` entries.
 */

/** One round, or a group of consecutive rounds once the log is merged. */
export interface RqaoaRoundEntry {
  /** First and last round covered (equal unless merged). */
  from: number;
  to: number;
  /** Free spins (qubits of the reduced operator) when round `from` started. */
  spins: number;
  /** Depots whose side the correlations fixed in these rounds. */
  eliminated: number;
  /** … of which kept on the same side as their partner (or side 0 when fixed alone), and on the other. */
  same: number;
  opposite: number;
  /** Depots fixed because no term was left on them (any side gives the same cost). */
  dropped: number;
  /** Largest and smallest |⟨Z_uZ_v⟩| (or |⟨Z_u⟩|) imposed; 0 when nothing was imposed. */
  strongest: number;
  weakest: number;
  /** Level-1 angles of round `from`. */
  gamma: number;
  beta: number;
}

/** Most entries a stored log holds. */
export const ROUND_LOG_CAP = 120;

export interface RoundInfo { round: number; spins: number; gamma: number; beta: number }
export interface RoundStep { round: number; sign: 1 | -1; correlation: number }

/**
 * Build the log from the rounds (as reported while running) and the depot eliminations (each
 * tagged with its round; spins dropped without terms carry correlation 0 and the round in which
 * they were dropped, 0 before the first).
 */
export function roundLog(rounds: readonly RoundInfo[], steps: readonly RoundStep[], cap = ROUND_LOG_CAP): RqaoaRoundEntry[] {
  const byRound = new Map<number, RqaoaRoundEntry>();
  const entry = (round: number): RqaoaRoundEntry => {
    let e = byRound.get(round);
    if (!e) {
      const info = rounds.find((r) => r.round === round);
      e = { from: round, to: round, spins: info?.spins ?? 0, eliminated: 0, same: 0, opposite: 0, dropped: 0, strongest: 0, weakest: 0, gamma: info?.gamma ?? 0, beta: info?.beta ?? 0 };
      byRound.set(round, e);
    }
    return e;
  };
  for (const r of rounds) entry(r.round);
  for (const s of steps) {
    const e = entry(s.round);
    if (s.correlation === 0) { e.dropped++; continue; }
    const c = Math.abs(s.correlation);
    e.weakest = e.eliminated === 0 ? c : Math.min(e.weakest, c);
    e.strongest = Math.max(e.strongest, c);
    e.eliminated++;
    if (s.sign > 0) e.same++;
    else e.opposite++;
  }
  const all = [...byRound.values()].sort((a, b) => a.from - b.from);
  if (all.length <= cap) return all;
  const group = Math.ceil(all.length / cap);
  const out: RqaoaRoundEntry[] = [];
  for (let i = 0; i < all.length; i += group) {
    const part = all.slice(i, i + group);
    const withPicks = part.filter((e) => e.eliminated > 0);
    out.push({
      from: part[0].from,
      to: part[part.length - 1].to,
      spins: part[0].spins,
      eliminated: part.reduce((a, e) => a + e.eliminated, 0),
      same: part.reduce((a, e) => a + e.same, 0),
      opposite: part.reduce((a, e) => a + e.opposite, 0),
      dropped: part.reduce((a, e) => a + e.dropped, 0),
      strongest: withPicks.reduce((a, e) => Math.max(a, e.strongest), 0),
      weakest: withPicks.length ? withPicks.reduce((a, e) => Math.min(a, e.weakest), Infinity) : 0,
      gamma: part[0].gamma,
      beta: part[0].beta,
    });
  }
  return out;
}
