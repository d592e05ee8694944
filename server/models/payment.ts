import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

export const PAYMENT_PURPOSES = ['credits', 'run', 'seats'] as const;
export type PaymentPurpose = (typeof PAYMENT_PURPOSES)[number];
/** open → paid | failed | expired; paid → refunded (card refund of a failed paid run). */
export type PaymentStatus = 'open' | 'paid' | 'failed' | 'expired' | 'refunded';

/** One checkout at the payment provider (a checkout session), as we track it. */
export interface PaymentRow {
  id: number;
  organisationId: number;
  purpose: PaymentPurpose;
  runId: number | null;
  quantity: number;
  /** Total, integer cents. */
  amount: number;
  currency: string;
  status: PaymentStatus;
  providerSessionId: string;
  providerPaymentIntent: string | null;
  cardLast4: string | null;
  failureMessage: string | null;
  payerEmail: string | null;
  createdBy: number | null;
  paidAt: Date | null;
  receiptSentAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
export type PaymentModel = Model<PaymentRow, Optional<PaymentRow, 'id' | 'runId' | 'quantity' | 'providerPaymentIntent' | 'cardLast4' | 'failureMessage' | 'payerEmail' | 'createdBy' | 'paidAt' | 'receiptSentAt' | 'createdAt' | 'updatedAt'>> & PaymentRow;

export function definePayment(db: Sequelize) {
  return db.define<PaymentModel>(
    'Payment',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      purpose: { type: DataTypes.STRING(16), allowNull: false },
      runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      quantity: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      amount: { type: DataTypes.INTEGER, allowNull: false },
      currency: { type: DataTypes.STRING(3), allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      providerSessionId: { type: DataTypes.STRING(191), allowNull: false },
      providerPaymentIntent: { type: DataTypes.STRING(191), allowNull: true },
      cardLast4: { type: DataTypes.STRING(4), allowNull: true },
      failureMessage: { type: DataTypes.STRING(300), allowNull: true },
      payerEmail: { type: DataTypes.STRING(254), allowNull: true },
      createdBy: { type: DataTypes.INTEGER, allowNull: true },
      paidAt: { type: DataTypes.DATE, allowNull: true },
      receiptSentAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'payments', underscored: true },
  );
}
