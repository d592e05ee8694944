import { DataTypes, type Model, type Optional, type Sequelize } from 'sequelize';
import type { Role } from '../../shared/permissions';

export interface InvitationRow {
  id: number;
  organisationId: number;
  email: string;
  role: Role;
  tokenHash: string; // sha256 hex of the link token; the token itself is only in the e-mail
  invitedByUserId: number | null;
  expiresAt: Date;
  acceptedAt: Date | null;
  acceptedByUserId: number | null;
  createdAt: Date;
  updatedAt: Date;
}
export type InvitationModel = Model<InvitationRow, Optional<InvitationRow, 'id' | 'acceptedAt' | 'acceptedByUserId' | 'createdAt' | 'updatedAt'>> & InvitationRow;

export function defineInvitation(db: Sequelize) {
  return db.define<InvitationModel>(
    'Invitation',
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false },
      invitedByUserId: { type: DataTypes.INTEGER, allowNull: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      acceptedByUserId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { tableName: 'invitations', underscored: true },
  );
}
