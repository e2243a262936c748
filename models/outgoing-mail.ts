import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export type MailStatus = "pending" | "sent" | "failed";

/** A message in the outgoing queue: stored first, then sent and retried with backoff until it goes out. */
export class OutgoingMail extends Model<InferAttributes<OutgoingMail>, InferCreationAttributes<OutgoingMail>> {
  declare id: CreationOptional<number>;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare status: CreationOptional<MailStatus>;
  declare attempts: CreationOptional<number>;
  declare lastError: CreationOptional<string | null>;
  declare nextAttemptAt: CreationOptional<Date>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OutgoingMail.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        textBody: { type: DataTypes.TEXT("medium"), allowNull: false },
        status: { type: DataTypes.ENUM("pending", "sent", "failed"), allowNull: false, defaultValue: "pending" },
        attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        lastError: { type: DataTypes.STRING(500), allowNull: true },
        nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false, defaultValue: DataTypes.NOW },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "outgoing_mails", underscored: true },
    );
  }
}
