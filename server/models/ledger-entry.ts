import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

/**
 * credit_purchase (+) bought credits · run_payment (+) a card payment for one run ·
 * run_spend (−) a run paid from the balance · run_refund (+) a failed paid run given back ·
 * card_refund (−) that refund sent back to the card.
 */
export const LEDGER_KINDS = ['credit_purchase', 'run_payment', 'run_spend', 'run_refund', 'card_refund'] as const;
export type LedgerKind = (typeof LEDGER_KINDS)[number];

/** One append-only credits ledger entry; rows are never updated or deleted. */
export interface LedgerEntryRow {
  id: number;
  organisationId: number;
  kind: LedgerKind;
  /** Signed integer cents: + adds to the balance, − spends it. */
  amount: number;
  currency: string;
  /** UNIQUE: the payment event id, or a derived key (`run:<id>:spend`), so a replay writes once. */
  sourceKey: string;
  eventId: string | null;
  paymentId: number | null;
  runId: number | null;
  note: string | null;
  createdBy: number | null;
  createdAt: Date;
}
export type LedgerEntryModel = Model<LedgerEntryRow, Optional<LedgerEntryRow, 'id' | 'eventId' | 'paymentId' | 'runId' | 'note' | 'createdBy' | 'createdAt'>> & LedgerEntryRow;

export function defineLedgerEntry(db: Sequelize) {
  return db.define<LedgerEntryModel>(
    'LedgerEntry',
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.STRING(24), allowNull: false },
      amount: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      sourceKey: { type: DataTypes.STRING(191), allowNull: false },
      eventId: { type: DataTypes.STRING(191), allowNull: true },
      paymentId: { type: DataTypes.INTEGER, allowNull: true },
      runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      note: { type: DataTypes.STRING(300), allowNull: true },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { tableName: 'ledger_entries', underscored: true, updatedAt: false },
  );
}
