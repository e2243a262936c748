import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { DisputeState } from "../lib/review/states";

/** One recorded change of a dispute's state: who, when, from, to. Inserted only. */
export class DisputeTransition extends Model<InferAttributes<DisputeTransition>, InferCreationAttributes<DisputeTransition>> {
  declare id: CreationOptional<number>;
  declare reviewId: number;
  declare actorId: number;
  declare fromState: DisputeState | null;
  declare toState: DisputeState;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    const states = DataTypes.ENUM("raised", "answered", "withdrawn", "upheld");
    DisputeTransition.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        reviewId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        fromState: { type: states, allowNull: true },
        toState: { type: states, allowNull: false },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "dispute_transitions", underscored: true, updatedAt: false },
    );
  }
}
