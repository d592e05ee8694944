import type { QueryInterface } from 'sequelize';

/** Networks and their immutable versions (document as LONGTEXT JSON plus summary columns). */
export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  await qi.createTable('networks', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    organisation_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    latest_version_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    latest_number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    depot_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    lane_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    total_volume: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    demo_key: { type: DataTypes.STRING(40), allowNull: true },
    created_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    deleted_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('networks', ['organisation_id', 'deleted_at', 'updated_at'], { name: 'networks_org_live_updated' });
  await qi.addIndex('networks', ['organisation_id', 'demo_key'], { name: 'networks_org_demo' });

  await qi.createTable('network_versions', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    network_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'networks', key: 'id' }, onDelete: 'RESTRICT' },
    organisation_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    document: { type: DataTypes.TEXT('long'), allowNull: false },
    depot_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    lane_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    total_volume: { type: DataTypes.DOUBLE, allowNull: false },
    component_count: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    min_degree: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    max_degree: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
    has_coordinates: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    source: { type: DataTypes.STRING(16), allowNull: false },
    note: { type: DataTypes.STRING(300), allowNull: true },
    created_by: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('network_versions', ['network_id', 'number'], { unique: true, name: 'network_versions_network_number' });
  await qi.addIndex('network_versions', ['organisation_id'], { name: 'network_versions_org' });
}

export async function down(qi: QueryInterface) {
  await qi.dropTable('network_versions');
  await qi.dropTable('networks');
}
