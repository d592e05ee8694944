import type { QueryInterface } from 'sequelize';

/**
 * Job errors are shown to every member of an organisation. Before solver faults were kept to the
 * worker's log, a failed job stored the fault's own text — file paths of the server included
 * ("internal error in the solver: Cannot find module '/srv/…'"). Those rows get the sentences the
 * worker writes now (server/workers/solve-task.ts, thread-slot.ts, worker.ts); input problems
 * (settings, refusals) never had these prefixes and are left alone.
 */
const REWRITES: [prefix: string, now: string][] = [
  ['internal error in the solver: ', "internal error in the solver; the details are in the solve worker's log"],
  ['the solver thread crashed: ', "the solver thread crashed; the details are in the solve worker's log"],
  ['the job could not be processed: ', "the job could not be processed; the details are in the solve worker's log"],
];

export async function up(qi: QueryInterface) {
  for (const [prefix, now] of REWRITES) {
    // LIKE with the prefix's own characters escaped (none of these prefixes contains % or _).
    await qi.sequelize.query('UPDATE run_jobs SET error = ? WHERE error LIKE ?', { replacements: [now, `${prefix}%`] });
  }
}

export async function down() {
  // The old texts are gone on purpose (they exposed server paths).
}
