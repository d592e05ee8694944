import type { QueryInterface } from 'sequelize';

/**
 * Billing: checkout payments, the append-only credits ledger (balance = SUM(amount); every entry
 * has a UNIQUE source_key — a payment event id or a derived key such as `run:12:spend` — so a
 * replayed event or a double click writes once), the price held with each paid run, and seats
 * bought on top of the plan (also append-only, summed).
 */
export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  const org = { type: DataTypes.INTEGER, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' };
  const stamps = { created_at: { type: DataTypes.DATE, allowNull: false }, updated_at: { type: DataTypes.DATE, allowNull: false } };

  await qi.createTable('payments', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organisation_id: org,
    purpose: { type: DataTypes.STRING(16), allowNull: false },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    quantity: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    amount: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    provider_session_id: { type: DataTypes.STRING(191), allowNull: false, unique: true },
    provider_payment_intent: { type: DataTypes.STRING(191), allowNull: true },
    card_last4: { type: DataTypes.STRING(4), allowNull: true },
    failure_message: { type: DataTypes.STRING(300), allowNull: true },
    payer_email: { type: DataTypes.STRING(254), allowNull: true },
    created_by: { type: DataTypes.INTEGER, allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    receipt_sent_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('payments', ['organisation_id', 'created_at'], { name: 'payments_org_created' });
  await qi.addIndex('payments', ['run_id'], { name: 'payments_run' });

  await qi.createTable('ledger_entries', {
    id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
    organisation_id: org,
    kind: { type: DataTypes.STRING(24), allowNull: false },
    amount: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    source_key: { type: DataTypes.STRING(191), allowNull: false, unique: true },
    event_id: { type: DataTypes.STRING(191), allowNull: true },
    payment_id: { type: DataTypes.INTEGER, allowNull: true },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
    note: { type: DataTypes.STRING(300), allowNull: true },
    created_by: { type: DataTypes.INTEGER, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('ledger_entries', ['organisation_id', 'id'], { name: 'ledger_entries_org' });

  await qi.createTable('run_charges', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    run_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true, references: { model: 'runs', key: 'id' }, onDelete: 'CASCADE' },
    organisation_id: org,
    amount: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    lines: { type: DataTypes.TEXT, allowNull: false },
    status: { type: DataTypes.STRING(16), allowNull: false },
    paid_with: { type: DataTypes.STRING(8), allowNull: true },
    payment_id: { type: DataTypes.INTEGER, allowNull: true },
    failure_message: { type: DataTypes.STRING(300), allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    refunded_at: { type: DataTypes.DATE, allowNull: true },
    ...stamps,
  });
  await qi.addIndex('run_charges', ['organisation_id', 'status'], { name: 'run_charges_org_status' });

  await qi.createTable('seat_grants', {
    id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
    organisation_id: org,
    seats: { type: DataTypes.INTEGER, allowNull: false },
    source_key: { type: DataTypes.STRING(191), allowNull: false, unique: true },
    payment_id: { type: DataTypes.INTEGER, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('seat_grants', ['organisation_id'], { name: 'seat_grants_org' });
}

export async function down(qi: QueryInterface) {
  for (const t of ['seat_grants', 'run_charges', 'ledger_entries', 'payments']) await qi.dropTable(t);
}
