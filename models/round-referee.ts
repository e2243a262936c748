import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A referee of a round with their own due date (the round's, unless the editor moved it). */
export class RoundReferee extends Model<InferAttributes<RoundReferee>, InferCreationAttributes<RoundReferee>> {
  declare roundId: number;
  declare userId: number;
  declare dueAt: Date;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RoundReferee.init(
      {
        roundId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        userId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        dueAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "round_referees", underscored: true, updatedAt: false },
    );
  }
}
