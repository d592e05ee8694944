import { DataTypes, type Sequelize } from 'sequelize';

/** Browser sessions (connect-session-sequelize reads and writes this model). */
export function defineSession(db: Sequelize) {
  return db.define(
    'Session',
    {
      sid: { type: DataTypes.STRING(64), primaryKey: true },
      expires: { type: DataTypes.DATE, allowNull: true },
      data: { type: DataTypes.TEXT, allowNull: true },
    },
    { tableName: 'sessions', underscored: true },
  );
}
