import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import { NOTIFICATION_KINDS, type NotificationKind } from "./notification";

/** Whether a person gets e-mail for one kind of notification (no row: yes). */
export class NotificationPreference extends Model<InferAttributes<NotificationPreference>, InferCreationAttributes<NotificationPreference>> {
  declare userId: number;
  declare kind: NotificationKind;
  declare email: boolean;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    NotificationPreference.init(
      {
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        kind: { type: DataTypes.ENUM(...NOTIFICATION_KINDS), primaryKey: true },
        email: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "notification_preferences", underscored: true, createdAt: false },
    );
  }
}
