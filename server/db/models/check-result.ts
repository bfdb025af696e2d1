import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * One member's check to one standard: the capacity it was checked from (CheckCapacityModel).
 * The result is that capacity with the member's design force applied by the engine's withForce.
 */
export class CheckResultModel extends Model<InferAttributes<CheckResultModel>, InferCreationAttributes<CheckResultModel>> {
  declare id: CreationOptional<number>;
  declare memberId: number;
  declare standard: string;
  declare engineVersion: string;
  declare capacityId: number;
  declare createdAt: CreationOptional<Date>;
}

/** The engine's result without a force (modes, trace, assumptions, warnings), stored once per import and input. */
export class CheckCapacityModel extends Model<InferAttributes<CheckCapacityModel>, InferCreationAttributes<CheckCapacityModel>> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare importKey: number | null;
  declare body: object;
  declare createdAt: CreationOptional<Date>;
}

export function initCheckResultModel(sequelize: Sequelize): void {
  CheckResultModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      memberId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'member_id' },
      standard: { type: DataTypes.STRING(20), allowNull: false },
      engineVersion: { type: DataTypes.STRING(20), allowNull: false, field: 'engine_version' },
      capacityId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'capacity_id' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'check_results', modelName: 'CheckResult', updatedAt: false },
  );
  CheckCapacityModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      revisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'revision_id' },
      importKey: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'import_key' },
      body: { type: DataTypes.JSON, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'check_capacities', modelName: 'CheckCapacity', updatedAt: false },
  );
}
