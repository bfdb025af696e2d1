import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { JobStatus } from '@shared/api/models';

/** One uploaded file of a model, with the state of its import job. */
export class RevisionModel extends Model<InferAttributes<RevisionModel>, InferCreationAttributes<RevisionModel>> {
  declare id: CreationOptional<number>;
  declare modelId: number;
  declare number: number;
  declare fileName: string;
  declare fileSize: number;
  declare sha256: string;
  declare storageKey: string;
  /** A forces table stored with the upload, applied when the revision is checked. */
  declare forcesStorageKey: CreationOptional<string | null>;
  /** Moves whenever the revision's member results change; in-memory readers compare it. */
  declare resultsVersion: CreationOptional<number>;
  declare uploadedById: number | null;
  declare standard: string;
  declare status: JobStatus;
  declare progress: CreationOptional<number>;
  declare failureId: CreationOptional<string | null>;
  declare failureMessage: CreationOptional<string | null>;
  declare attempts: CreationOptional<number>;
  declare claimedBy: CreationOptional<string | null>;
  declare heartbeatAt: CreationOptional<Date | null>;
  declare schemaName: CreationOptional<string | null>;
  declare summary: CreationOptional<object | null>;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initRevisionModel(sequelize: Sequelize): void {
  RevisionModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      modelId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'model_id' },
      number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      fileName: { type: DataTypes.STRING(255), allowNull: false, field: 'file_name' },
      fileSize: { type: DataTypes.BIGINT.UNSIGNED, allowNull: false, field: 'file_size', get() { return Number(this.getDataValue('fileSize')); } },
      sha256: { type: DataTypes.CHAR(64), allowNull: false },
      storageKey: { type: DataTypes.STRING(255), allowNull: false, field: 'storage_key' },
      forcesStorageKey: { type: DataTypes.STRING(255), allowNull: true, field: 'forces_storage_key' },
      resultsVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0, field: 'results_version' },
      uploadedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'uploaded_by_id' },
      standard: { type: DataTypes.STRING(20), allowNull: false },
      status: { type: DataTypes.STRING(16), allowNull: false },
      progress: { type: DataTypes.FLOAT, allowNull: false, defaultValue: 0 },
      failureId: { type: DataTypes.STRING(60), allowNull: true, field: 'failure_id' },
      failureMessage: { type: DataTypes.TEXT, allowNull: true, field: 'failure_message' },
      attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      claimedBy: { type: DataTypes.STRING(80), allowNull: true, field: 'claimed_by' },
      heartbeatAt: { type: DataTypes.DATE, allowNull: true, field: 'heartbeat_at' },
      schemaName: { type: DataTypes.STRING(20), allowNull: true, field: 'schema_name' },
      summary: { type: DataTypes.JSON, allowNull: true },
      startedAt: { type: DataTypes.DATE, allowNull: true, field: 'started_at' },
      finishedAt: { type: DataTypes.DATE, allowNull: true, field: 'finished_at' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'revisions', modelName: 'Revision' },
  );
}
