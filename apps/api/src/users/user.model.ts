import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from 'sequelize';
import type { Role } from '@rhotrace/api-types';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string;
  declare active: CreationOptional<boolean>;
  declare tokenVersion: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export class PasswordReset extends Model<
  InferAttributes<PasswordReset>,
  InferCreationAttributes<PasswordReset>
> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare tokenSha256: string;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
}

export class SignInThrottle extends Model<
  InferAttributes<SignInThrottle>,
  InferCreationAttributes<SignInThrottle>
> {
  declare keySha256: string;
  declare failures: number;
  declare firstFailureAt: Date;
  declare lockedUntil: Date | null;
}

export function initUserModels(sequelize: Sequelize): void {
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      role: { type: DataTypes.STRING(16), allowNull: false },
      passwordHash: { type: DataTypes.STRING(100), allowNull: false },
      active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
      tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE(3),
      updatedAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'users', underscored: true },
  );
  PasswordReset.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      tokenSha256: { type: DataTypes.CHAR(64), allowNull: false },
      expiresAt: { type: DataTypes.DATE(3), allowNull: false },
      usedAt: { type: DataTypes.DATE(3), allowNull: true },
      createdAt: DataTypes.DATE(3),
    },
    { sequelize, tableName: 'password_resets', underscored: true, updatedAt: false },
  );
  SignInThrottle.init(
    {
      keySha256: { type: DataTypes.CHAR(64), primaryKey: true },
      failures: { type: DataTypes.INTEGER, allowNull: false },
      firstFailureAt: { type: DataTypes.DATE(3), allowNull: false },
      lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
    },
    { sequelize, tableName: 'sign_in_throttles', underscored: true, timestamps: false },
  );
}
