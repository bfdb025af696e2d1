import { DataTypes, type QueryInterface } from 'sequelize';

/** The outgoing-mail queue (kept, so nothing is lost while the mail service is down) and one-time links. */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.createTable('mail_messages', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    to_addresses: { type: DataTypes.JSON, allowNull: false },
    subject: { type: DataTypes.STRING(255), allowNull: false },
    text_body: { type: DataTypes.TEXT('medium'), allowNull: false },
    attachments: { type: DataTypes.JSON, allowNull: false },
    project_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'projects', key: 'id' }, onDelete: 'SET NULL' },
    created_by_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    status: { type: DataTypes.STRING(12), allowNull: false },
    attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    next_attempt_at: { type: DataTypes.DATE, allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('mail_messages', ['status', 'next_attempt_at']);
  await qi.createTable('one_time_tokens', {
    id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
    user_id: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    purpose: { type: DataTypes.STRING(20), allowNull: false },
    token_hash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('one_time_tokens', ['user_id', 'purpose']);
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('one_time_tokens');
  await qi.dropTable('mail_messages');
}
