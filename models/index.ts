import type { Sequelize } from "sequelize";
import { ApiToken } from "./api-token";
import { AuditEvent } from "./audit-event";
import { ClassAnswer } from "./class-answer";
import { ClassParticipant } from "./class-participant";
import { ClassQuestion } from "./class-question";
import { ClassSession } from "./class-session";
import { Invitation } from "./invitation";
import { Membership } from "./membership";
import { PasswordResetToken } from "./password-reset-token";
import { Run } from "./run";
import { RunSensor } from "./run-sensor";
import { RunVersion } from "./run-version";
import { Scenario } from "./scenario";
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
const MODELS = {
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
  Scenario,
  ClassSession,
  ClassParticipant,
  ClassQuestion,
  ClassAnswer,
};

export function initModels(sequelize: Sequelize): typeof MODELS {
  for (const model of Object.values(MODELS)) model.initModel(sequelize);
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
  ClassSession.belongsTo(User, { foreignKey: "hostId", as: "host" });
  ClassSession.hasMany(ClassParticipant, { foreignKey: "sessionId", as: "participants" });
  ClassParticipant.belongsTo(User, { foreignKey: "userId", as: "user" });
  ClassQuestion.hasMany(ClassAnswer, { foreignKey: "questionId", as: "answers" });
  ClassAnswer.belongsTo(ClassParticipant, { foreignKey: "participantId", as: "participant" });
  return MODELS;
}

export {
  ApiToken,
  AuditEvent,
  ClassAnswer,
  ClassParticipant,
  ClassQuestion,
  ClassSession,
  Invitation,
  Membership,
  PasswordResetToken,
  Run,
  RunSensor,
  RunVersion,
  Scenario,
  Sensor,
  SignInAttempt,
  Site,
  User,
  Vehicle,
  Workspace,
};
