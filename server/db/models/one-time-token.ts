import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type TokenPurpose = 'invitation' | 'password-reset';

/** A one-time link; only the SHA-256 of the token is stored, so a database leak gives no links. */
export class OneTimeTokenModel extends Model<InferAttributes<OneTimeTokenModel>, InferCreationAttributes<OneTimeTokenModel>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare purpose: TokenPurpose;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare usedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
}

export function initOneTimeTokenModel(sequelize: Sequelize): void {
  OneTimeTokenModel.init(
    {
      id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, field: 'user_id' },
      purpose: { type: DataTypes.STRING(20), allowNull: false },
      tokenHash: { type: DataTypes.CHAR(64), allowNull: false, field: 'token_hash' },
      expiresAt: { type: DataTypes.DATE, allowNull: false, field: 'expires_at' },
      usedAt: { type: DataTypes.DATE, allowNull: true, field: 'used_at' },
      createdAt: { type: DataTypes.DATE, field: 'created_at' },
    },
    { sequelize, tableName: 'one_time_tokens', modelName: 'OneTimeToken', updatedAt: false },
  );
}
