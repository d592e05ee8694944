import { DataTypes, type Model, type ModelStatic, type Sequelize } from 'sequelize';
import type { VersionSource } from '../../shared/schemas/networks';

/**
 * One immutable version of a network: the whole document as JSON text plus summary columns.
 * Runs refer to a version id, so a version is never updated or deleted once written (the hooks
 * below refuse it, whatever code path tries).
 */
export interface NetworkVersionRow {
  id: number;
  networkId: number;
  organisationId: number;
  number: number;
  /** JSON of the NetworkDocument (depots, lanes, name). */
  document: string;
  depotCount: number;
  laneCount: number;
  totalVolume: number;
  componentCount: number;
  minDegree: number;
  maxDegree: number;
  hasCoordinates: boolean;
  source: VersionSource;
  note: string | null;
  createdBy: number | null;
  createdAt: Date;
}

export type NetworkVersionModel = ModelStatic<Model<NetworkVersionRow, Partial<NetworkVersionRow>>>;

export const VERSION_IMMUTABLE_MESSAGE = 'network versions are immutable; save a new version instead';

export function defineNetworkVersion(db: Sequelize): NetworkVersionModel {
  const refuse = () => {
    throw new Error(VERSION_IMMUTABLE_MESSAGE);
  };
  return db.define(
    'NetworkVersion',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      networkId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      organisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      document: { type: DataTypes.TEXT('long'), allowNull: false },
      depotCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      laneCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      totalVolume: { type: DataTypes.DOUBLE, allowNull: false },
      componentCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      minDegree: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      maxDegree: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      hasCoordinates: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      source: { type: DataTypes.STRING(16), allowNull: false },
      note: { type: DataTypes.STRING(300), allowNull: true },
      createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    },
    {
      tableName: 'network_versions',
      underscored: true,
      updatedAt: false,
      hooks: { beforeUpdate: refuse, beforeBulkUpdate: refuse, beforeDestroy: refuse, beforeBulkDestroy: refuse },
    },
  ) as NetworkVersionModel;
}
