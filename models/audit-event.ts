import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** Append-only: the app inserts these and never updates or deletes them. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare proofId: number | null;
  declare actorId: number | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: number | null;
  declare detail: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        proofId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        actorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        action: { type: DataTypes.STRING(60), allowNull: false },
        subjectType: { type: DataTypes.STRING(30), allowNull: false },
        subjectId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        detail: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "audit_events", underscored: true, updatedAt: false },
    );
  }
}
