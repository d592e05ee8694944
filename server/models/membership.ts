import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';
import type { Role } from '../../shared/permissions';

export interface MembershipRow {
  id: number;
  organisationId: number;
  userId: number;
  role: Role;
  createdAt: Date;
  updatedAt: Date;
}
export type MembershipModel = Model<MembershipRow, Optional<MembershipRow, 'id' | 'createdAt' | 'updatedAt'>> & MembershipRow;

export function defineMembership(db: Sequelize) {
  return db.define<MembershipModel>(
    'Membership',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'memberships', underscored: true },
  );
}
