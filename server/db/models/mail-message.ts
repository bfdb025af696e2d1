import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type MailStatus = 'queued' | 'sending' | 'sent' | 'retrying' | 'failed';
export interface StoredAttachment {
  filename: string;
  contentType: string;
  /** File under DATA_DIR/mail-attachments. */
  path: string;
}

/** One outgoing e-mail; the row is the outbox entry admins read and the retry state. */
export class MailMessageModel extends Model<InferAttributes<MailMessageModel>, InferCreationAttributes<MailMessageModel>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare toAddresses: string[];
  declare subject: string;
  declare textBody: string;
  declare attachments: StoredAttachment[];
  declare projectId: number | null;
  declare createdById: number | null;
  declare status: MailStatus;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: CreationOptional<Date | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMailMessageModel(sequelize: Sequelize): void {
  MailMessageModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      kind: { type: DataTypes.STRING(40), allowNull: false },
      toAddresses: { type: DataTypes.JSON, allowNull: false, field: 'to_addresses' },
      subject: { type: DataTypes.STRING(255), allowNull: false },
      textBody: { type: DataTypes.TEXT('medium'), allowNull: false, field: 'text_body' },
      attachments: { type: DataTypes.JSON, allowNull: false },
      projectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'project_id' },
      createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'created_by_id' },
      status: { type: DataTypes.STRING(12), allowNull: false },
      attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      lastError: { type: DataTypes.TEXT, allowNull: true, field: 'last_error' },
      nextAttemptAt: { type: DataTypes.DATE, allowNull: true, field: 'next_attempt_at' },
      sentAt: { type: DataTypes.DATE, allowNull: true, field: 'sent_at' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'mail_messages', modelName: 'MailMessage' },
  );
}
