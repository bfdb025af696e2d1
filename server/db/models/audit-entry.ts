import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Who did what, when and why: account changes now, engineering overrides later. */
export class AuditEntryModel extends Model<InferAttributes<AuditEntryModel>, InferCreationAttributes<AuditEntryModel>> {
  declare id: CreationOptional<number>;
  declare actorId: number | null;
  declare projectId: number | null;
  declare action: string;
  declare subject: string;
  declare detail: object;
  declare reason: string | null;
  declare createdAt: CreationOptional<Date>;
}

export function initAuditEntryModel(sequelize: Sequelize): void {
  AuditEntryModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'actor_id' },
      projectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'project_id' },
      action: { type: DataTypes.STRING(60), allowNull: false },
      subject: { type: DataTypes.STRING(200), allowNull: false },
      detail: { type: DataTypes.JSON, allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: true },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'audit_entries', modelName: 'AuditEntry', updatedAt: false },
  );
}
