import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

/** awaiting → paid → (refunded when the run failed without an answer) → awaiting again (round + 1) when it is retried. */
export type RunChargeStatus = 'awaiting' | 'paid' | 'refunded';

/** The price held with a paid run (priceOfRun at creation), and how it was settled. */
export interface RunChargeRow {
  id: number;
  runId: number;
  organisationId: number;
  /** Integer cents. */
  amount: number;
  currency: string;
  /** JSON of the price lines shown before launch. */
  lines: string;
  status: RunChargeStatus;
  /** 1 for the first payment; a refunded run that runs again is charged again in the next round. */
  round: number;
  paidWith: 'credits' | 'card' | null;
  paymentId: number | null;
  /** The last failed card payment's reason, shown on the run. */
  failureMessage: string | null;
  paidAt: Date | null;
  refundedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
export type RunChargeModel = Model<RunChargeRow, Optional<RunChargeRow, 'id' | 'round' | 'paidWith' | 'paymentId' | 'failureMessage' | 'paidAt' | 'refundedAt' | 'createdAt' | 'updatedAt'>> & RunChargeRow;

export function defineRunCharge(db: Sequelize) {
  return db.define<RunChargeModel>(
    'RunCharge',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      amount: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      lines: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      round: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      paidWith: { type: DataTypes.STRING(8), allowNull: true },
      paymentId: { type: DataTypes.INTEGER, allowNull: true },
      failureMessage: { type: DataTypes.STRING(300), allowNull: true },
      paidAt: { type: DataTypes.DATE, allowNull: true },
      refundedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'run_charges', underscored: true },
  );
}
