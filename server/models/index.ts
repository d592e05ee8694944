import type { Sequelize } from 'sequelize';
import { defineSession } from './session';
import { defineUser } from './user';
import { defineOrganisation } from './organisation';
import { defineMembership } from './membership';
import { defineInvitation } from './invitation';
import { definePasswordReset } from './password-reset';
import { defineAuditEvent } from './audit-event';
import { defineApiToken } from './api-token';
import { defineNetwork } from './network';
import { defineNetworkVersion } from './network-version';
import { defineRun } from './run';
import { defineRunJob } from './run-job';
import { definePayment } from './payment';
import { defineRunCharge } from './payment-run-charge';
import { defineLedgerEntry } from './ledger-entry';
import { defineSeatGrant } from './ledger-seat-grant';

/** All Sequelize models, defined once per database handle. Tables come from migrations only. */
export function defineModels(db: Sequelize) {
  const Session = defineSession(db);
  const accounts = { User: defineUser(db), Organisation: defineOrganisation(db), Membership: defineMembership(db), Invitation: defineInvitation(db), PasswordReset: definePasswordReset(db), AuditEvent: defineAuditEvent(db), ApiToken: defineApiToken(db) };
  const Network = defineNetwork(db);
  const NetworkVersion = defineNetworkVersion(db);
  const runs = { Run: defineRun(db), RunJob: defineRunJob(db) };
  const billing = { Payment: definePayment(db), RunCharge: defineRunCharge(db), LedgerEntry: defineLedgerEntry(db), SeatGrant: defineSeatGrant(db) };
  return { Session, ...accounts, Network, NetworkVersion, ...runs, ...billing };
}
export type Models = ReturnType<typeof defineModels>;
