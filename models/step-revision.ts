import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** An immutable revision of a step: its Markdown and the claims attached at that moment; numbered 1, 2, … per step. */
export class StepRevision extends Model<InferAttributes<StepRevision>, InferCreationAttributes<StepRevision>> {
  declare id: CreationOptional<number>;
  declare stepId: number;
  declare number: number;
  declare body: string;
  declare authorId: number;
  /** The revision the author was editing when saving (null for a step's first revision). */
  declare baseRevisionId: CreationOptional<number | null>;
  /** The claims attached at this revision, as JSON (lib/review/revisions.ts RevisionClaim[]). */
  declare claimSet: CreationOptional<string | null>;
  /** SHA-256 of text and claim set (lib/core/certificates/revision-digest.ts): what a vouch at this revision covers. */
  declare digest: CreationOptional<string | null>;
  /** "claims" when made by attaching, withdrawing or re-deciding a claim; "text" when saved from the editor. */
  declare origin: CreationOptional<"text" | "claims">;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StepRevision.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        stepId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        number: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        body: { type: DataTypes.TEXT("medium"), allowNull: false },
        authorId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        baseRevisionId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        claimSet: { type: DataTypes.TEXT("medium"), allowNull: true },
        digest: { type: DataTypes.CHAR(64), allowNull: true },
        origin: { type: DataTypes.ENUM("text", "claims"), allowNull: false, defaultValue: "text" },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "step_revisions", underscored: true, updatedAt: false },
    );
  }
}
