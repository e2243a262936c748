import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { User } from "./user";

export class Proof extends Model<InferAttributes<Proof>, InferCreationAttributes<Proof>> {
  declare id: CreationOptional<number>;
  declare title: string;
  declare statement: string;
  declare requiredApprovals: CreationOptional<number>;
  declare createdBy: ForeignKey<User["id"]>;
  /** Blind review: authors see referees as "Referee 1, 2, …"; editors always see names. */
  declare blindReview: CreationOptional<boolean>;
  /** Reminder e-mails to referees this many days before / after their due date (0 = none). */
  declare remindBeforeDays: CreationOptional<number>;
  declare remindAfterDays: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Proof.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        title: { type: DataTypes.STRING(300), allowNull: false },
        statement: { type: DataTypes.TEXT("medium"), allowNull: false },
        requiredApprovals: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        blindReview: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        remindBeforeDays: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 3 },
        remindAfterDays: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "proofs", underscored: true },
    );
  }
}
