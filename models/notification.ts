import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const NOTIFICATION_KINDS = [
  "assigned",
  "dispute_raised",
  "dispute_answered",
  "dispute_withdrawn",
  "dispute_upheld",
  "vouch_superseded",
  "comment_added",
] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** An in-app notice for one person. */
export class Notification extends Model<InferAttributes<Notification>, InferCreationAttributes<Notification>> {
  declare id: CreationOptional<number>;
  declare userId: number;
  declare proofId: number | null;
  declare stepId: number | null;
  declare kind: NotificationKind;
  declare message: string;
  declare link: string | null;
  declare readAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Notification.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        kind: { type: DataTypes.ENUM(...NOTIFICATION_KINDS), allowNull: false },
        message: { type: DataTypes.STRING(500), allowNull: false },
        link: { type: DataTypes.STRING(300), allowNull: true },
        readAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "notifications", underscored: true, updatedAt: false },
    );
  }
}
