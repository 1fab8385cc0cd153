import type { Sequelize } from "sequelize";
import { AuditEvent } from "./audit-event";
import { Invitation } from "./invitation";
import { Membership } from "./membership";
import { PasswordResetToken } from "./password-reset-token";
import { SignInAttempt } from "./sign-in-attempt";
import { User } from "./user";
import { Workspace } from "./workspace";

/** Define every model on one Sequelize instance and wire their associations. */
export function initModels(sequelize: Sequelize) {
  for (const model of [User, Workspace, Membership, Invitation, PasswordResetToken, AuditEvent, SignInAttempt]) {
    model.initModel(sequelize);
  }
  Membership.belongsTo(User, { foreignKey: "userId", as: "user" });
  Membership.belongsTo(Workspace, { foreignKey: "workspaceId", as: "workspace" });
  User.hasMany(Membership, { foreignKey: "userId", as: "memberships" });
  Workspace.hasMany(Membership, { foreignKey: "workspaceId", as: "memberships" });
  Invitation.belongsTo(Workspace, { foreignKey: "workspaceId", as: "workspace" });
  Invitation.belongsTo(User, { foreignKey: "invitedById", as: "invitedBy" });
  AuditEvent.belongsTo(User, { foreignKey: "actorId", as: "actor" });
  return { User, Workspace, Membership, Invitation, PasswordResetToken, AuditEvent, SignInAttempt };
}

export { AuditEvent, Invitation, Membership, PasswordResetToken, SignInAttempt, User, Workspace };
