import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ModelChoice, RunStatus, Verdict } from "@/lib/fleet-terms";

/** The site a run was fitted against, copied so later edits to the site do not rewrite history. */
export interface SiteSnapshot {
  siteId: string | null;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
}

export interface RunError {
  message: string;
  row?: number;
  column?: string;
}

export class Run extends Model<InferAttributes<Run>, InferCreationAttributes<Run>> {
  declare id: CreationOptional<string>;
  declare workspaceId: string;
  declare vehicleId: string;
  declare siteId: string | null;
  declare site: SiteSnapshot | null;
  declare capturedOn: string;
  declare uploadedById: string | null;
  declare title: CreationOptional<string>;
  declare powersMotors: CreationOptional<boolean>;
  /** When someone confirmed the motor-run cautions for this capture (null: never). */
  declare safetyAcknowledgedAt: CreationOptional<Date | null>;
  declare safetyAcknowledgedById: CreationOptional<string | null>;
  declare simulated: CreationOptional<boolean>;
  declare sharedWithStudents: CreationOptional<boolean>;
  declare fileKey: string;
  declare fileName: string;
  declare fileSize: number;
  declare fileSha256: CreationOptional<string | null>;
  /** CSV column name → canonical field ("compass_a.x", "time", …). */
  declare columnMapping: Record<string, string>;
  /** Units per sensor kind: { field: "uT", accel: "m/s2", rate: "rad/s", time: "s" } */
  declare units: Record<string, string>;
  /** Canonical slot ("compass_a") → sensor id. */
  declare sensorSlots: Record<string, string>;
  declare modelChoice: ModelChoice;
  declare status: CreationOptional<RunStatus>;
  declare progress: CreationOptional<number>;
  declare stage: CreationOptional<string>;
  declare error: CreationOptional<RunError | null>;
  declare currentVersionId: CreationOptional<string | null>;
  declare verdict: CreationOptional<Verdict | null>;
  declare coverageFraction: CreationOptional<number | null>;
  declare residualRms: CreationOptional<number | null>;
  declare fieldStrength: CreationOptional<number | null>;
  declare offsetNorm: CreationOptional<number | null>;
  declare signedOffAt: CreationOptional<Date | null>;
  declare signedOffById: CreationOptional<string | null>;
  declare signOffComment: CreationOptional<string | null>;
  declare signedOffVersionId: CreationOptional<string | null>;
  declare deletedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Run.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        workspaceId: { type: DataTypes.UUID, allowNull: false },
        vehicleId: { type: DataTypes.UUID, allowNull: false },
        siteId: DataTypes.UUID,
        site: DataTypes.JSONB,
        capturedOn: { type: DataTypes.DATEONLY, allowNull: false },
        uploadedById: DataTypes.UUID,
        title: { type: DataTypes.STRING(160), allowNull: false, defaultValue: "" },
        powersMotors: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        safetyAcknowledgedAt: DataTypes.DATE,
        safetyAcknowledgedById: DataTypes.UUID,
        simulated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        sharedWithStudents: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        fileKey: { type: DataTypes.STRING(300), allowNull: false },
        fileName: { type: DataTypes.STRING(255), allowNull: false },
        fileSize: {
          type: DataTypes.BIGINT,
          allowNull: false,
          get() {
            return Number(this.getDataValue("fileSize"));
          },
        },
        fileSha256: DataTypes.STRING(64),
        columnMapping: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        units: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        sensorSlots: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        modelChoice: { type: DataTypes.STRING(8), allowNull: false, defaultValue: "auto" },
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "awaiting-file" },
        progress: { type: DataTypes.REAL, allowNull: false, defaultValue: 0 },
        stage: { type: DataTypes.STRING(120), allowNull: false, defaultValue: "" },
        error: DataTypes.JSONB,
        currentVersionId: DataTypes.UUID,
        verdict: DataTypes.STRING(8),
        coverageFraction: DataTypes.DOUBLE,
        residualRms: DataTypes.DOUBLE,
        fieldStrength: DataTypes.DOUBLE,
        offsetNorm: DataTypes.DOUBLE,
        signedOffAt: DataTypes.DATE,
        signedOffById: DataTypes.UUID,
        signOffComment: DataTypes.TEXT,
        signedOffVersionId: DataTypes.UUID,
        deletedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      // Soft delete: Sequelize's paranoid mode filters deleted_at IS NULL everywhere.
      { sequelize, modelName: "Run", tableName: "runs", paranoid: true },
    );
  }
}
