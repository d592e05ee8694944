import type { Transaction } from 'sequelize';
import type { Deps } from '../deps';

/** Seats bought on top of the plan (SUM of the append-only seat grants); the invitation seat check adds these. */
export async function purchasedSeats(deps: Pick<Deps, 'models'>, organisationId: number, transaction?: Transaction): Promise<number> {
  return Number((await deps.models.SeatGrant.sum('seats', { where: { organisationId }, transaction })) || 0);
}
