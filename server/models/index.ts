import type { Sequelize } from 'sequelize';
import { defineSession } from './session';

/** All Sequelize models, defined once per database handle. Tables come from migrations only. */
export function defineModels(db: Sequelize) {
  const Session = defineSession(db);
  return { Session };
}
export type Models = ReturnType<typeof defineModels>;
