import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

/** Seats bought on top of the plan (append-only; purchased seats = SUM(seats)). */
export interface SeatGrantRow {
  id: number;
  organisationId: number;
  seats: number;
  /** UNIQUE: the payment event id that paid for them. */
  sourceKey: string;
  paymentId: number | null;
  createdAt: Date;
}
export type SeatGrantModel = Model<SeatGrantRow, Optional<SeatGrantRow, 'id' | 'paymentId' | 'createdAt'>> & SeatGrantRow;

export function defineSeatGrant(db: Sequelize) {
  return db.define<SeatGrantModel>(
    'SeatGrant',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      seats: { type: DataTypes.INTEGER, allowNull: false },
      sourceKey: { type: DataTypes.STRING(191), allowNull: false },
      paymentId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { tableName: 'seat_grants', underscored: true, updatedAt: false },
  );
}
