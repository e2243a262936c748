import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A reminder that was queued for a referee of a round; the key (round, referee, kind) makes it go out once. */
export class RoundReminder extends Model<InferAttributes<RoundReminder>, InferCreationAttributes<RoundReminder>> {
  declare roundId: number;
  declare userId: number;
  /** "before" (the configured days before the due date) or "after" (the configured days after it). */
  declare kind: string;
  declare mailId: number | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RoundReminder.init(
      {
        roundId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        kind: { type: DataTypes.STRING(20), primaryKey: true },
        mailId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "round_reminders", underscored: true, updatedAt: false },
    );
  }
}
