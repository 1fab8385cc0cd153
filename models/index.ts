import type { Sequelize } from "sequelize";
import { ApiToken } from "./api-token";
import { AuditEvent } from "./audit-event";
import { Invitation } from "./invitation";
import { Membership } from "./membership";
import { PasswordResetToken } from "./password-reset-token";
import { Run } from "./run";
import { RunSensor } from "./run-sensor";
import { RunVersion } from "./run-version";
import { Sensor } from "./sensor";
import { SignInAttempt } from "./sign-in-attempt";
import { Site } from "./site";
import { User } from "./user";
import { Vehicle } from "./vehicle";
import { Workspace } from "./workspace";

/**
 * Define every model on one Sequelize instance and wire their associations. Each model names
 * itself (modelName) so the production build's minified class names never reach SQL aliases.
 */
export function initModels(sequelize: Sequelize) {
  for (const model of [
    User,
    Workspace,
    Membership,
    Invitation,
    PasswordResetToken,
    AuditEvent,
    SignInAttempt,
    Site,
    Vehicle,
    Sensor,
    Run,
    RunSensor,
    RunVersion,
    ApiToken,
  ]) {
    model.initModel(sequelize);
  }
  Membership.belongsTo(User, { foreignKey: "userId", as: "user" });
  Membership.belongsTo(Workspace, { foreignKey: "workspaceId", as: "workspace" });
  User.hasMany(Membership, { foreignKey: "userId", as: "memberships" });
  Workspace.hasMany(Membership, { foreignKey: "workspaceId", as: "memberships" });
  Invitation.belongsTo(Workspace, { foreignKey: "workspaceId", as: "workspace" });
  Invitation.belongsTo(User, { foreignKey: "invitedById", as: "invitedBy" });
  AuditEvent.belongsTo(User, { foreignKey: "actorId", as: "actor" });
  Vehicle.hasMany(Sensor, { foreignKey: "vehicleId", as: "sensors" });
  Sensor.belongsTo(Vehicle, { foreignKey: "vehicleId", as: "vehicle" });
  Run.belongsTo(Vehicle, { foreignKey: "vehicleId", as: "vehicle" });
  Run.belongsTo(User, { foreignKey: "uploadedById", as: "uploadedBy" });
  Run.belongsTo(User, { foreignKey: "signedOffById", as: "signedOffBy" });
  Run.hasMany(RunVersion, { foreignKey: "runId", as: "versions" });
  Run.hasMany(RunSensor, { foreignKey: "runId", as: "runSensors" });
  RunSensor.belongsTo(Sensor, { foreignKey: "sensorId", as: "sensor" });
  ApiToken.belongsTo(User, { foreignKey: "userId", as: "user" });
  return {
    User,
    Workspace,
    Membership,
    Invitation,
    PasswordResetToken,
    AuditEvent,
    SignInAttempt,
    Site,
    Vehicle,
    Sensor,
    Run,
    RunSensor,
    RunVersion,
    ApiToken,
  };
}

export {
  ApiToken,
  AuditEvent,
  Invitation,
  Membership,
  PasswordResetToken,
  Run,
  RunSensor,
  RunVersion,
  Sensor,
  SignInAttempt,
  Site,
  User,
  Vehicle,
  Workspace,
};
