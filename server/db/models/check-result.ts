import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The engine's full answer for one member to one standard (modes, trace, assumptions, warnings). */
export class CheckResultModel extends Model<InferAttributes<CheckResultModel>, InferCreationAttributes<CheckResultModel>> {
  declare id: CreationOptional<number>;
  declare memberId: number;
  declare standard: string;
  declare engineVersion: string;
  declare result: object;
  declare createdAt: CreationOptional<Date>;
}

export function initCheckResultModel(sequelize: Sequelize): void {
  CheckResultModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      memberId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'member_id' },
      standard: { type: DataTypes.STRING(20), allowNull: false },
      engineVersion: { type: DataTypes.STRING(20), allowNull: false, field: 'engine_version' },
      result: { type: DataTypes.JSON, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'check_results', modelName: 'CheckResult', updatedAt: false },
  );
}
