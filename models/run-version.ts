import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { ModelChoice, Verdict } from "@/lib/fleet-terms";
import type { RunError, SiteSnapshot } from "./run";

export type VersionStatus = "queued" | "processing" | "done" | "failed";

/** One processing of a run (a model and a site); every re-processing keeps its own results. */
export class RunVersion extends Model<InferAttributes<RunVersion>, InferCreationAttributes<RunVersion>> {
  declare id: CreationOptional<string>;
  declare runId: string;
  declare number: number;
  declare modelChoice: ModelChoice;
  declare site: SiteSnapshot | null;
  declare status: CreationOptional<VersionStatus>;
  declare attempts: CreationOptional<number>;
  declare results: CreationOptional<Record<string, unknown> | null>;
  declare samplesKey: CreationOptional<string | null>;
  declare verdict: CreationOptional<Verdict | null>;
  declare error: CreationOptional<RunError | null>;
  declare requestedById: string | null;
  declare startedAt: CreationOptional<Date | null>;
  declare finishedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    RunVersion.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        runId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        modelChoice: { type: DataTypes.STRING(8), allowNull: false },
        site: DataTypes.JSONB,
        status: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "queued" },
        attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        results: DataTypes.JSONB,
        samplesKey: DataTypes.STRING(300),
        verdict: DataTypes.STRING(8),
        error: DataTypes.JSONB,
        requestedById: DataTypes.UUID,
        startedAt: DataTypes.DATE,
        finishedAt: DataTypes.DATE,
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: "RunVersion", tableName: "run_versions" },
    );
  }
}
