import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

export interface UserRow {
  id: number;
  email: string; // stored lower-case
  name: string;
  passwordHash: string; // bcrypt
  lastOrganisationId: number | null; // where the next sign-in lands
  createdAt: Date;
  updatedAt: Date;
}
export type UserModel = Model<UserRow, Optional<UserRow, 'id' | 'lastOrganisationId' | 'createdAt' | 'updatedAt'>> & UserRow;

export function defineUser(db: Sequelize) {
  return db.define<UserModel>(
    'User',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false },
      lastOrganisationId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'users', underscored: true },
  );
}
