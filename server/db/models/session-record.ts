import { DataTypes, Model, type Sequelize } from 'sequelize';

/** Rows of the session store (connect-session-sequelize reads and writes them). */
export class SessionRecordModel extends Model {}

export function initSessionRecordModel(sequelize: Sequelize): void {
  SessionRecordModel.init(
    {
      sid: { type: DataTypes.STRING(64), primaryKey: true },
      expires: { type: DataTypes.DATE, allowNull: true },
      data: { type: DataTypes.TEXT, allowNull: true },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'sessions', modelName: 'SessionRecord' },
  );
}
