import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ResultBand } from '@shared/api/results';

/** A candidate steel member of one revision, keyed by its IFC GlobalId, with its current check summary. */
export class MemberModel extends Model<InferAttributes<MemberModel>, InferCreationAttributes<MemberModel>> {
  declare id: CreationOptional<number>;
  declare revisionId: number;
  declare globalId: string;
  declare name: string | null;
  declare tag: string | null;
  declare ifcClass: string;
  declare storey: string | null;
  declare assembly: string | null;
  declare profileName: string | null;
  declare gradeName: string | null;
  declare lengthMm: number | null;
  declare isTension: boolean;
  declare inclusion: CreationOptional<'auto' | 'included' | 'excluded'>;
  declare inclusionReason: CreationOptional<string | null>;
  declare holeCount: CreationOptional<number>;
  declare designForceN: CreationOptional<number | null>;
  declare forceSource: CreationOptional<string | null>;
  declare netAreaMm2: CreationOptional<number | null>;
  declare designCapacityN: CreationOptional<number | null>;
  declare utilisation: CreationOptional<number | null>;
  declare governing: CreationOptional<string | null>;
  declare band: CreationOptional<ResultBand>;
  declare warningCount: CreationOptional<number>;
  declare detail: object;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initMemberModel(sequelize: Sequelize): void {
  const col = (type: DataTypes.DataType, field: string, allowNull = true) => ({ type, field, allowNull });
  MemberModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      revisionId: col(DataTypes.INTEGER.UNSIGNED, 'revision_id', false),
      globalId: col(DataTypes.STRING(22), 'global_id', false),
      name: col(DataTypes.STRING(255), 'name'),
      tag: col(DataTypes.STRING(120), 'tag'),
      ifcClass: col(DataTypes.STRING(60), 'ifc_class', false),
      storey: col(DataTypes.STRING(160), 'storey'),
      assembly: col(DataTypes.STRING(160), 'assembly'),
      profileName: col(DataTypes.STRING(120), 'profile_name'),
      gradeName: col(DataTypes.STRING(120), 'grade_name'),
      lengthMm: col(DataTypes.DOUBLE, 'length_mm'),
      isTension: col(DataTypes.BOOLEAN, 'is_tension', false),
      inclusion: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'auto' },
      inclusionReason: col(DataTypes.TEXT, 'inclusion_reason'),
      holeCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0, field: 'hole_count' },
      designForceN: col(DataTypes.DOUBLE, 'design_force_n'),
      forceSource: col(DataTypes.STRING(40), 'force_source'),
      netAreaMm2: col(DataTypes.DOUBLE, 'net_area_mm2'),
      designCapacityN: col(DataTypes.DOUBLE, 'design_capacity_n'),
      utilisation: col(DataTypes.DOUBLE, 'utilisation'),
      governing: col(DataTypes.STRING(60), 'governing'),
      band: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'unknown' },
      warningCount: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0, field: 'warning_count' },
      detail: { type: DataTypes.JSON, allowNull: false },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
      updatedAt: { type: DataTypes.DATE, field: 'updated_at' },
    },
    { sequelize, tableName: 'members', modelName: 'Member' },
  );
}
