import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A design axial force of a member for one load case (N, tension positive) and where it came from. */
export class MemberForceModel extends Model<InferAttributes<MemberForceModel>, InferCreationAttributes<MemberForceModel>> {
  declare id: CreationOptional<number>;
  declare memberId: number;
  declare loadCase: string;
  declare axialN: number;
  declare source: string;
  declare createdAt: CreationOptional<Date>;
}

export function initMemberForceModel(sequelize: Sequelize): void {
  MemberForceModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      memberId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'member_id' },
      loadCase: { type: DataTypes.STRING(120), allowNull: false, field: 'load_case' },
      axialN: { type: DataTypes.DOUBLE, allowNull: false, field: 'axial_n' },
      source: { type: DataTypes.STRING(40), allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'member_forces', modelName: 'MemberForce', updatedAt: false },
  );
}
