import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';

export interface AuditEventRow {
  id: number;
  organisationId: number | null; // null for events that belong to no organisation (e.g. unknown e-mail)
  actorUserId: number | null;
  action: string; // dotted verb, e.g. "member.role_changed"
  targetType: string | null;
  targetId: string | null;
  detail: string | null; // JSON text
  ip: string | null;
  createdAt: Date;
  updatedAt: Date;
}
export type AuditEventModel = Model<AuditEventRow, Optional<AuditEventRow, 'id' | 'organisationId' | 'actorUserId' | 'targetType' | 'targetId' | 'detail' | 'ip' | 'createdAt' | 'updatedAt'>> & AuditEventRow;

export function defineAuditEvent(db: Sequelize) {
  return db.define<AuditEventModel>(
    'AuditEvent',
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: true },
      actorUserId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(64), allowNull: false },
      targetType: { type: DataTypes.STRING(32), allowNull: true },
      targetId: { type: DataTypes.STRING(64), allowNull: true },
      detail: { type: DataTypes.TEXT, allowNull: true },
      ip: { type: DataTypes.STRING(64), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'audit_events', underscored: true },
  );
}
