/** All models, initialised once against the process's Sequelize instance, with their associations. */
import { getSequelize } from "@/lib/db";
import * as all from "./all";
import {
  User,
  Proof,
  ProofMember,
  Case,
  Step,
  StepRevision,
  Claim,
  Review,
  Comment,
  Invitation,
  InvitationCase,
  OutgoingMail,
  DisputeTransition,
  ProofExport,
  StepFile,
} from "./all";

function initModels() {
  const sequelize = getSequelize();
  for (const m of Object.values(all)) m.initModel(sequelize);
  Proof.belongsTo(User, { as: "creator", foreignKey: "createdBy" });
  Proof.hasMany(ProofMember, { as: "members", foreignKey: "proofId" });
  ProofMember.belongsTo(Proof, { as: "proof", foreignKey: "proofId" });
  ProofMember.belongsTo(User, { as: "user", foreignKey: "userId" });
  User.hasMany(ProofMember, { as: "memberships", foreignKey: "userId" });
  Proof.hasMany(Case, { as: "cases", foreignKey: "proofId" });
  Case.belongsTo(Proof, { as: "proof", foreignKey: "proofId" });
  Case.hasMany(Case, { as: "children", foreignKey: "parentId" });
  Case.hasMany(Step, { as: "steps", foreignKey: "caseId" });
  Step.belongsTo(Case, { as: "case", foreignKey: "caseId" });
  Step.hasMany(StepRevision, { as: "revisions", foreignKey: "stepId" });
  StepRevision.belongsTo(User, { as: "author", foreignKey: "authorId" });
  Step.hasMany(Claim, { as: "claims", foreignKey: "stepId" });
  Claim.belongsTo(User, { as: "checker", foreignKey: "checkedBy", constraints: false });
  Claim.belongsTo(User, { as: "withdrawer", foreignKey: "withdrawnBy", constraints: false });
  Step.hasMany(Review, { as: "reviews", foreignKey: "stepId" });
  Review.belongsTo(User, { as: "reviewer", foreignKey: "reviewerId" });
  Step.hasMany(Comment, { as: "comments", foreignKey: "stepId" });
  Comment.belongsTo(User, { as: "author", foreignKey: "authorId" });
  Invitation.belongsTo(OutgoingMail, { as: "mail", foreignKey: "mailId" });
  Invitation.hasMany(InvitationCase, { as: "cases", foreignKey: "invitationId" });
  DisputeTransition.belongsTo(User, { as: "actor", foreignKey: "actorId" });
  ProofExport.belongsTo(User, { as: "creator", foreignKey: "createdBy" });
  StepFile.belongsTo(User, { as: "uploader", foreignKey: "uploadedBy" });
}

/** Returns the models, initialising them on first use (not at import: `next build` imports without a database). */
export function models() {
  // Checked on the class itself, so a module reloaded by the dev server initialises its own classes.
  if (!User.sequelize) initModels();
  return all;
}

export * from "./all";
