import { DataTypes, literal, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Every e-mail the app sends, recorded before it is queued: the queue (pg-boss, its own schema) only
// carries the row's id, so a message survives restarts and its status is the row's.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('mail_messages', {
    id: { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: literal('gen_random_uuid()') },
    organisation_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    job_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'jobs', key: 'id' }, onDelete: 'SET NULL' },
    job_event_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'job_events', key: 'id' }, onDelete: 'SET NULL' },
    purpose: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    recipient: { type: DataTypes.TEXT, allowNull: false },
    reply_to: { type: DataTypes.STRING(254), allowNull: true },
    subject: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    html: { type: DataTypes.TEXT, allowNull: true },
    attachments: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'waiting' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('now()') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: literal('now()') },
  });
  await qi.sequelize.query(`ALTER TABLE mail_messages ADD CONSTRAINT mail_messages_status_chk CHECK (status IN ('waiting','sent','failed'))`);
  await qi.addIndex('mail_messages', ['organisation_id', 'created_at']);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('mail_messages');
};
