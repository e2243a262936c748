import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A case an invitation is limited to. */
export class InvitationCase extends Model<InferAttributes<InvitationCase>, InferCreationAttributes<InvitationCase>> {
  declare invitationId: number;
  declare caseId: number;

  static initModel(sequelize: Sequelize) {
    InvitationCase.init(
      {
        invitationId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        caseId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
      },
      { sequelize, tableName: "invitation_cases", underscored: true, timestamps: false },
    );
  }
}
