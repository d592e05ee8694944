import type { QueryInterface } from 'sequelize';

/**
 * Runs (one network version + one problem) and their jobs (one per solver entry). Results are
 * JSON text; `attempt` guards the exactly-once result write, `generation` tells retried jobs
 * from their earlier queue entries.
 */
export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  await qi.createTable('runs', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organisation_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    network_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    version_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    created_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    problem: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.STRING(20), allowNull: false },
    held: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    priority: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 5 },
    seed: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
    time_limit_seconds: { type: DataTypes.DOUBLE, allowNull: false },
    depot_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    notified_at: { type: DataTypes.DATE, allowNull: true },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('runs', ['organisation_id', 'deleted_at', 'created_at'], { name: 'runs_org_live_created' });
  await qi.addIndex('runs', ['organisation_id', 'network_id'], { name: 'runs_org_network' });

  await qi.createTable('run_jobs', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    organisation_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    position: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    solver: { type: DataTypes.STRING(40), allowNull: false },
    settings: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    generation: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    attempt: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    live: { type: DataTypes.TEXT, allowNull: true },
    worker: { type: DataTypes.STRING(120), allowNull: true },
    queued_at: { type: DataTypes.DATE, allowNull: true },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
    result: { type: DataTypes.TEXT('long'), allowNull: true },
    error: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('run_jobs', ['run_id', 'position'], { unique: true, name: 'run_jobs_run_position' });
  await qi.addIndex('run_jobs', ['organisation_id'], { name: 'run_jobs_org' });
  await qi.addIndex('run_jobs', ['status'], { name: 'run_jobs_status' });
}

export async function down(qi: QueryInterface) {
  await qi.dropTable('run_jobs');
  await qi.dropTable('runs');
}
