import { DataTypes, type Model, type ModelStatic, type Sequelize } from 'sequelize';

/** A named network of one organisation; its content lives in immutable versions. */
export interface NetworkRow {
  id: number;
  organisationId: number;
  name: string;
  /** Latest version's id and number, and its summary copied here so lists need no join. */
  latestVersionId: number | null;
  latestNumber: number;
  depotCount: number;
  laneCount: number;
  totalVolume: number;
  /** Set for the seeded demo copies (ensureDemoNetworks is idempotent on it). */
  demoKey: string | null;
  createdBy: number | null;
  deletedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

export type NetworkModel = ModelStatic<Model<NetworkRow, Partial<NetworkRow>>>;

export function defineNetwork(db: Sequelize): NetworkModel {
  return db.define(
    'Network',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      latestVersionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      latestNumber: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      depotCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      laneCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      totalVolume: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      demoKey: { type: DataTypes.STRING(40), allowNull: true },
      createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { tableName: 'networks', underscored: true },
  ) as NetworkModel;
}
