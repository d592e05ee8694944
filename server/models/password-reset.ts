import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

export interface PasswordResetRow {
  id: number;
  userId: number;
  tokenHash: string; // sha256 hex of the e-mailed one-time token
  expiresAt: Date;
  usedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
export type PasswordResetModel = Model<PasswordResetRow, Optional<PasswordResetRow, 'id' | 'usedAt' | 'createdAt' | 'updatedAt'>> & PasswordResetRow;

export function definePasswordReset(db: Sequelize) {
  return db.define<PasswordResetModel>(
    'PasswordReset',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      usedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'password_resets', underscored: true },
  );
}
