import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Membership of a user in a project; only members (and admins) see a project. */
export class ProjectMemberModel extends Model<InferAttributes<ProjectMemberModel>, InferCreationAttributes<ProjectMemberModel>> {
  declare projectId: number;
  declare userId: number;
  declare createdAt: CreationOptional<Date>;
}

export function initProjectMemberModel(sequelize: Sequelize): void {
  ProjectMemberModel.init(
    {
      projectId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, field: 'project_id' },
      userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true, field: 'user_id' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'project_members', modelName: 'ProjectMember', updatedAt: false },
  );
}
