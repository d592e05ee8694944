import { DataTypes, type Model, type ModelStatic, type Sequelize } from 'sequelize';
import type { RunStatus } from '../../shared/schemas/runs';

/** A run: one immutable network version + one problem (JSON) + its jobs (run_jobs). */
export interface RunRow {
  id: number;
  organisationId: number;
  networkId: number;
  versionId: number;
  createdBy: number | null;
  /** JSON of the ProblemInput as given (kind, k, pins, tolerance). */
  problem: string;
  /** Derived from the jobs (deriveRunStatus), stored so lists can filter on it. */
  status: RunStatus;
  /** Held back (awaiting payment): jobs stay off the queue until releaseRun. */
  held: boolean;
  /** BullMQ priority (lower runs first); from the organisation's plan. */
  priority: number;
  seed: number;
  timeLimitSeconds: number;
  depotCount: number;
  /** Last handed to the queue (creation, payment, retry); durations count from here (null: older rows, use createdAt). */
  releasedAt: Date | null;
  finishedAt: Date | null;
  /** Set once when the "run finished" e-mail went out (guards against sending twice). */
  notifiedAt: Date | null;
  deletedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
}

export type RunModel = ModelStatic<Model<RunRow, Partial<RunRow>>>;

export function defineRun(db: Sequelize): RunModel {
  return db.define(
    'Run',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      networkId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      versionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      createdBy: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
      problem: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.STRING(20), allowNull: false },
      held: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      priority: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5 },
      seed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
      timeLimitSeconds: { type: DataTypes.DOUBLE, allowNull: false },
      depotCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      releasedAt: { type: DataTypes.DATE, allowNull: true },
      finishedAt: { type: DataTypes.DATE, allowNull: true },
      notifiedAt: { type: DataTypes.DATE, allowNull: true },
      deletedAt: { type: DataTypes.DATE, allowNull: true },
    },
    { tableName: 'runs', underscored: true },
  ) as RunModel;
}
