import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

export interface ApiTokenRow {
  id: number;
  organisationId: number;
  userId: number;
  name: string;
  prefix: string; // first characters, shown in lists so people can tell tokens apart
  tokenHash: string; // sha256 hex; the token itself is shown once at creation
  lastUsedAt: Date | null;
  revokedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}
export type ApiTokenModel = Model<ApiTokenRow, Optional<ApiTokenRow, 'id' | 'lastUsedAt' | 'revokedAt' | 'createdAt' | 'updatedAt'>> & ApiTokenRow;

export function defineApiToken(db: Sequelize) {
  return db.define<ApiTokenModel>(
    'ApiToken',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(80), allowNull: false },
      prefix: { type: DataTypes.STRING(16), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false },
      lastUsedAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'api_tokens', underscored: true },
  );
}
