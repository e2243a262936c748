import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Failed sign-ins per (e-mail, client) key, hashed so that no address is stored here. */
export class SignInThrottle extends Model<InferAttributes<SignInThrottle>, InferCreationAttributes<SignInThrottle>> {
  declare keyHash: string;
  declare failures: number;
  declare lockedUntil: Date | null;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SignInThrottle.init(
      {
        keyHash: { type: DataTypes.CHAR(64), primaryKey: true },
        failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "sign_in_throttles", underscored: true, createdAt: false },
    );
  }
}
