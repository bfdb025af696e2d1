import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A named building model in a project; each upload of it is a revision. */
export class IfcModelModel extends Model<InferAttributes<IfcModelModel>, InferCreationAttributes<IfcModelModel>> {
  declare id: CreationOptional<number>;
  declare projectId: number;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initIfcModelModel(sequelize: Sequelize): void {
  IfcModelModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      projectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'project_id' },
      name: { type: DataTypes.STRING(160), allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'models', modelName: 'IfcModel' },
  );
}
