import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

export interface OrganisationRow {
  id: number;
  name: string;
  plan: string; // a PlanId from shared/plans.ts
  closedAt: Date | null; // closed organisations keep their audit trail but have no members
  createdAt: Date;
  updatedAt: Date;
}
export type OrganisationModel = Model<OrganisationRow, Optional<OrganisationRow, 'id' | 'plan' | 'closedAt' | 'createdAt' | 'updatedAt'>> & OrganisationRow;

export function defineOrganisation(db: Sequelize) {
  return db.define<OrganisationModel>(
    'Organisation',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      plan: { type: DataTypes.STRING(32), allowNull: false, defaultValue: 'free' },
      closedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'organisations', underscored: true },
  );
}
