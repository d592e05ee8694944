import type { QueryInterface } from 'sequelize';

/**
 * Money and time of paid runs:
 * - `runs.released_at`: when the run was last handed to the queue (at creation for free runs, at
 *   payment for held ones, at a retry). A run's duration counts from here, so time spent waiting
 *   for payment is not solving time.
 * - `run_charges.round`: a refunded run that runs again is charged again; each round has its own
 *   ledger keys (`run:<id>:spend`, `run:<id>:spend:2`, …), so a second payment is not a replay.
 */
export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  await qi.addColumn('runs', 'released_at', { type: DataTypes.DATE, allowNull: true });
  await qi.addColumn('run_charges', 'round', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 });
}

export async function down(qi: QueryInterface) {
  await qi.removeColumn('run_charges', 'round');
  await qi.removeColumn('runs', 'released_at');
}
