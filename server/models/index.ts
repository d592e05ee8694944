import type { Sequelize } from 'sequelize';
import { defineSession } from './session';
import { defineNetwork } from './network';
import { defineNetworkVersion } from './network-version';

/** All Sequelize models, defined once per database handle. Tables come from migrations only. */
export function defineModels(db: Sequelize) {
  const Session = defineSession(db);
  const Network = defineNetwork(db);
  const NetworkVersion = defineNetworkVersion(db);
  return { Session, Network, NetworkVersion };
}
export type Models = ReturnType<typeof defineModels>;
