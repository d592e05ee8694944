import type { QueryInterface } from 'sequelize';

export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  await qi.createTable('sessions', {
    sid: { type: DataTypes.STRING(64), primaryKey: true },
    expires: { type: DataTypes.DATE, allowNull: true },
    data: { type: DataTypes.TEXT('medium'), allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('sessions', ['expires']);
}

export async function down(qi: QueryInterface) {
  await qi.dropTable('sessions');
}
