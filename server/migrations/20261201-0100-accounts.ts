import type { QueryInterface } from 'sequelize';

/** Accounts: users, organisations, memberships, invitations, password resets, audit events, API tokens. */
export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  const stamps = {
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  };
  const id = { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true };
  const ref = (table: string, allowNull = false, onDelete = 'CASCADE') => ({ type: DataTypes.INTEGER, allowNull, references: { model: table, key: 'id' }, onDelete });

  await qi.createTable('organisations', {
    id,
    name: { type: DataTypes.STRING(120), allowNull: false },
    plan: { type: DataTypes.STRING(32), allowNull: false, defaultValue: 'free' },
    closed_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.createTable('users', {
    id,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: false },
    last_organisation_id: { type: DataTypes.INTEGER, allowNull: true },
    ...stamps,
  });
  await qi.createTable('memberships', {
    id,
    organisation_id: ref('organisations'),
    user_id: ref('users'),
    role: { type: DataTypes.STRING(16), allowNull: false },
    ...stamps,
  });
  await qi.addIndex('memberships', ['organisation_id', 'user_id'], { unique: true, name: 'memberships_org_user' });
  await qi.addIndex('memberships', ['user_id']);

  await qi.createTable('invitations', {
    id,
    organisation_id: ref('organisations'),
    email: { type: DataTypes.STRING(254), allowNull: false },
    role: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    invited_by_user_id: ref('users', true, 'SET NULL'),
    expires_at: { type: DataTypes.DATE, allowNull: false },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_by_user_id: ref('users', true, 'SET NULL'),
    ...stamps,
  });
  await qi.addIndex('invitations', ['organisation_id', 'email']);

  await qi.createTable('password_resets', {
    id,
    user_id: ref('users'),
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('password_resets', ['user_id']);

  await qi.createTable('audit_events', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    organisation_id: ref('organisations', true),
    actor_user_id: ref('users', true, 'SET NULL'),
    action: { type: DataTypes.STRING(64), allowNull: false },
    target_type: { type: DataTypes.STRING(32), allowNull: true },
    target_id: { type: DataTypes.STRING(64), allowNull: true },
    detail: { type: DataTypes.TEXT, allowNull: true },
    ip: { type: DataTypes.STRING(64), allowNull: true },
    ...stamps,
  });
  await qi.addIndex('audit_events', ['organisation_id', 'id']);

  await qi.createTable('api_tokens', {
    id,
    organisation_id: ref('organisations'),
    user_id: ref('users'),
    name: { type: DataTypes.STRING(80), allowNull: false },
    prefix: { type: DataTypes.STRING(16), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    last_used_at: { type: DataTypes.DATE, allowNull: true },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('api_tokens', ['organisation_id']);
  await qi.addIndex('api_tokens', ['user_id']);
}

export async function down(qi: QueryInterface) {
  for (const t of ['api_tokens', 'audit_events', 'password_resets', 'invitations', 'memberships', 'users', 'organisations']) await qi.dropTable(t);
}
