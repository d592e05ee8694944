import { DataTypes, type Model, type ModelStatic, type Sequelize } from 'sequelize';
import type { JobStatus } from '../../shared/schemas/runs';

/**
 * One solver entry of a run, processed as one queue job. `generation` grows on every retry (the
 * queue job id carries it, so a stale queue entry is recognised); `attempt` grows every time a
 * worker claims the job, and the result is written only by the claim that still holds it
 * (UPDATE … WHERE status = 'running' AND attempt = mine).
 */
export interface RunJobRow {
  id: number;
  runId: number;
  organisationId: number;
  position: number;
  solver: string;
  /** JSON of the settings as given (validated by the solver's parseSettings at creation). */
  settings: string;
  status: JobStatus;
  generation: number;
  attempt: number;
  progress: number;
  /** JSON of the latest JobProgress (iteration, best value, energy ± error). */
  live: string | null;
  worker: string | null;
  queuedAt: Date | null;
  startedAt: Date | null;
  finishedAt: Date | null;
  /** JSON of the checked RunResult (value, assignment, bound, gap, trace, samples …). */
  result: string | null;
  /** The result's value, feasibility and proof as columns (services/runs/answer-columns.ts); null without a result. */
  answerValue: number | null;
  answerFeasible: boolean | null;
  answerProven: boolean | null;
  error: string | null;
  createdAt: Date;
  updatedAt: Date;
}

export type RunJobModel = ModelStatic<Model<RunJobRow, Partial<RunJobRow>>>;

export function defineRunJob(db: Sequelize): RunJobModel {
  return db.define(
    'RunJob',
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      runId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      organisationId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      solver: { type: DataTypes.STRING(40), allowNull: false },
      settings: { type: DataTypes.TEXT, allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      generation: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      attempt: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      live: { type: DataTypes.TEXT, allowNull: true },
      worker: { type: DataTypes.STRING(120), allowNull: true },
      queuedAt: { type: DataTypes.DATE, allowNull: true },
      startedAt: { type: DataTypes.DATE, allowNull: true },
      finishedAt: { type: DataTypes.DATE, allowNull: true },
      result: { type: DataTypes.TEXT('long'), allowNull: true },
      answerValue: { type: DataTypes.DOUBLE, allowNull: true },
      answerFeasible: { type: DataTypes.BOOLEAN, allowNull: true },
      answerProven: { type: DataTypes.BOOLEAN, allowNull: true },
      error: { type: DataTypes.TEXT, allowNull: true },
    },
    { tableName: 'run_jobs', underscored: true },
  ) as RunJobModel;
}
