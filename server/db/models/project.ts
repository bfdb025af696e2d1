import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { StandardId } from '@shared/api/projects';

export class ProjectModel extends Model<InferAttributes<ProjectModel>, InferCreationAttributes<ProjectModel>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare description: CreationOptional<string>;
  declare standard: CreationOptional<StandardId>;
  declare defaultGrade: CreationOptional<string>;
  declare createdById: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initProjectModel(sequelize: Sequelize): void {
  ProjectModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(120), allowNull: false },
      description: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
      standard: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'as4100' },
      defaultGrade: { type: DataTypes.STRING(60), allowNull: false, defaultValue: 'AS/NZS 3679.1-300', field: 'default_grade' },
      createdById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true, field: 'created_by_id' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'projects', modelName: 'Project' },
  );
}
