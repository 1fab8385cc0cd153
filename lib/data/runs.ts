import "server-only";
import { Op, type Order, type WhereOptions } from "sequelize";
import { recogniseColumns } from "@/geometry/column-names";
import { motorColumnsOf, type MotorField } from "@/geometry/motor-safety";
import { compareSlots, familyOfSlot } from "@/geometry/sensor-slots";
import type { CaptureField } from "@/geometry/types";
import { InvalidFieldError, UserFacingError } from "@/lib/errors";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import { UPLOAD_LIMITS, type ModelChoice, type RunStatus, type VehicleKind } from "@/lib/fleet-terms";
import { readHeaderCells } from "@/lib/ingest/csv-table";
import { enqueueVersion } from "@/lib/jobs/queue";
import { snapshotOf } from "@/lib/data/sites";
import { motorRunConfirmationMessage } from "@/lib/motor-cautions";
import { objectSize, presignUpload, readObjectHead } from "@/lib/storage";
import type { RunListQuery } from "@/lib/validations/runs";
import type { Run, RunVersion, Sensor, User, Vehicle } from "@/models";
import type { RunError, SiteSnapshot } from "@/models/run";

export interface RunSummary {
  id: string;
  vehicleId: string;
  vehicleName: string;
  title: string;
  capturedOn: string;
  site: SiteSnapshot | null;
  uploadedById: string | null;
  uploadedByName: string | null;
  fileName: string;
  fileSize: number;
  status: RunStatus;
  progress: number;
  stage: string;
  error: RunError | null;
  modelChoice: ModelChoice;
  verdict: string | null;
  coverageFraction: number | null;
  residualRms: number | null;
  fieldStrength: number | null;
  offsetNorm: number | null;
  powersMotors: boolean;
  simulated: boolean;
  sharedWithStudents: boolean;
  signedOffAt: string | null;
  createdAt: string;
}

export interface RunSensorSlot {
  slot: string;
  sensorId: string;
  label: string;
  kind: string;
  mountingRotation: string;
}

export interface RunVersionSummary {
  id: string;
  number: number;
  modelChoice: ModelChoice;
  site: SiteSnapshot | null;
  status: string;
  verdict: string | null;
  attempts: number;
  error: RunError | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface RunDetail extends RunSummary {
  /** The kind of the run's vehicle, for words that depend on it ("Do not sail on this calibration"). */
  vehicleKind: VehicleKind;
  columnMapping: Record<string, string>;
  units: Record<string, string>;
  fileSha256: string | null;
  sensors: RunSensorSlot[];
  versions: RunVersionSummary[];
  currentVersionId: string | null;
  signedOffByName: string | null;
  signOffComment: string | null;
  signedOffVersionId: string | null;
}

type RunRow = Run & { vehicle?: Vehicle; uploadedBy?: User | null; signedOffBy?: User | null };

function toSummary(r: RunRow): RunSummary {
  return {
    id: r.id,
    vehicleId: r.vehicleId,
    vehicleName: r.vehicle?.name ?? "",
    title: r.title,
    capturedOn: r.capturedOn,
    site: r.site,
    uploadedById: r.uploadedById,
    uploadedByName: r.uploadedBy?.name ?? null,
    fileName: r.fileName,
    fileSize: r.fileSize,
    status: r.status,
    progress: r.progress,
    stage: r.stage,
    error: r.error ?? null,
    modelChoice: r.modelChoice,
    verdict: r.verdict ?? null,
    coverageFraction: r.coverageFraction ?? null,
    residualRms: r.residualRms ?? null,
    fieldStrength: r.fieldStrength ?? null,
    offsetNorm: r.offsetNorm ?? null,
    powersMotors: r.powersMotors,
    simulated: r.simulated,
    sharedWithStudents: r.sharedWithStudents,
    signedOffAt: r.signedOffAt?.toISOString() ?? null,
    createdAt: r.createdAt.toISOString(),
  };
}

function toVersion(v: RunVersion): RunVersionSummary {
  return {
    id: v.id,
    number: v.number,
    modelChoice: v.modelChoice,
    site: v.site,
    status: v.status,
    verdict: v.verdict ?? null,
    attempts: v.attempts,
    error: v.error ?? null,
    createdAt: v.createdAt.toISOString(),
    finishedAt: v.finishedAt?.toISOString() ?? null,
  };
}

function includes() {
  const { Vehicle: VehicleModel, User: UserModel } = db().models;
  return [
    { model: VehicleModel, as: "vehicle", attributes: ["id", "name", "kind"] },
    { model: UserModel, as: "uploadedBy", attributes: ["id", "name"] },
    { model: UserModel, as: "signedOffBy", attributes: ["id", "name"] },
  ];
}

export interface CreateRunInput {
  vehicleId: string;
  siteId?: string | null;
  capturedOn: string;
  title: string;
  fileName: string;
  fileSize: number;
  columnMapping: Record<string, string>;
  units: Record<string, string | number>;
  sensorSlots: Record<string, string>;
  model: ModelChoice;
  powersMotors: boolean;
  /** The file's column names, when the caller knows them: recognised here to tell a motor run. */
  columns?: string[];
  /** The person confirmed the motor-run cautions. */
  safetyAcknowledged?: boolean;
  /** Made by the simulator: no motor ran, so no confirmation is asked (the cautions still show). */
  simulated?: boolean;
  sharedWithStudents?: boolean;
}

/** Enough of a stored capture to read its header line. */
const HEADER_PEEK_BYTES = 64 * 1024;

type ColumnMap = Record<string, CaptureField | "ignore">;
type MotorColumn = { header: string; field: MotorField };

/** The motor current and throttle columns among a file's column names, read as the worker will read them. */
function motorColumnsIn(headers: string[], columnMapping: Record<string, string>): MotorColumn[] {
  return motorColumnsOf(recogniseColumns(headers, columnMapping as ColumnMap));
}

/** The motor columns of the file in storage, from its header line (a ranged read of its head). */
async function motorColumnsInStoredFile(run: Run): Promise<MotorColumn[]> {
  const head = await readObjectHead(run.fileKey, HEADER_PEEK_BYTES);
  const headers = readHeaderCells(new TextDecoder("utf-8").decode(head));
  // A header that cannot be read is the worker's to report, with its row and reason.
  return headers ? motorColumnsIn(headers, run.columnMapping) : [];
}

/**
 * The stored file is a motor run: unless the cautions were confirmed (before, or with this
 * request), refuse with the column that makes it one. Simulated runs spun no motor.
 */
async function requireMotorConfirmation(run: Run, found: MotorColumn[], confirmedNow: boolean): Promise<void> {
  if (found.length === 0 || run.safetyAcknowledgedAt || confirmedNow || run.simulated) return;
  const vehicle = await db().models.Vehicle.findByPk(run.vehicleId, { attributes: ["kind"], paranoid: false });
  throw new InvalidFieldError(motorRunConfirmationMessage(found, vehicle?.kind), "safetyAcknowledged");
}

/**
 * Register a run and hand back a presigned URL the file goes to, straight to object storage.
 * Every id in the input must belong to this workspace (and sensors to this vehicle). The
 * server decides whether it is a motor run: a current or throttle column among `columns`
 * makes it one whatever `powersMotors` says, and a motor run needs `safetyAcknowledged`.
 */
export async function createRun(
  workspaceId: string,
  actorId: string,
  input: CreateRunInput,
): Promise<{ run: RunSummary; uploadUrl: string }> {
  const { sequelize, models } = db();
  const vehicle = await models.Vehicle.findOne({ where: { workspaceId, id: input.vehicleId } });
  if (!vehicle) throw new UserFacingError("That vehicle is not in this workspace.", "vehicleId");
  const site = input.siteId ? await models.Site.findOne({ where: { workspaceId, id: input.siteId } }) : null;
  if (input.siteId && !site) throw new UserFacingError("That site is not in this workspace.", "siteId");
  const sensorIds = [...new Set(Object.values(input.sensorSlots))];
  const sensors = sensorIds.length ? await models.Sensor.findAll({ where: { workspaceId, vehicleId: vehicle.id, id: sensorIds } }) : [];
  if (sensors.length !== sensorIds.length) throw new UserFacingError("Every sensor must be one of this vehicle's sensors.", "sensorSlots");
  for (const [slot, sensorId] of Object.entries(input.sensorSlots)) {
    const sensor = sensors.find((s) => s.id === sensorId)!;
    const family = familyOfSlot(slot);
    const expected = family === "mag" ? "magnetometer" : family === "accel" ? "accelerometer" : "gyroscope";
    if (sensor.kind !== expected)
      throw new UserFacingError(`Slot ${slot} needs a ${expected}; "${sensor.label}" is a ${sensor.kind}.`, "sensorSlots");
  }
  const declaredMotorColumns = input.columns ? motorColumnsIn(input.columns, input.columnMapping) : [];
  const powersMotors = input.powersMotors || declaredMotorColumns.length > 0;
  const acknowledged = input.safetyAcknowledged === true;
  if (powersMotors && !acknowledged && !input.simulated) {
    throw new InvalidFieldError(
      declaredMotorColumns.length
        ? motorRunConfirmationMessage(declaredMotorColumns, vehicle.kind)
        : "This capture powers motors: confirm the safety cautions first.",
      "safetyAcknowledged",
    );
  }
  const safeName = input.fileName.replace(/[^A-Za-z0-9._-]+/g, "_").slice(-120);
  const run = await sequelize.transaction(async (transaction) => {
    const created = await models.Run.create(
      {
        workspaceId,
        vehicleId: vehicle.id,
        siteId: site?.id ?? null,
        site: site ? snapshotOf(site) : null,
        capturedOn: input.capturedOn,
        uploadedById: actorId,
        title: input.title,
        powersMotors,
        safetyAcknowledgedAt: acknowledged ? new Date() : null,
        safetyAcknowledgedById: acknowledged ? actorId : null,
        simulated: input.simulated ?? false,
        sharedWithStudents: input.sharedWithStudents ?? false,
        fileKey: "pending",
        fileName: input.fileName,
        fileSize: input.fileSize,
        columnMapping: input.columnMapping,
        units: Object.fromEntries(Object.entries(input.units).map(([k, v]) => [k, String(v)])),
        sensorSlots: input.sensorSlots,
        modelChoice: input.model,
      },
      { transaction },
    );
    await created.update({ fileKey: `workspaces/${workspaceId}/runs/${created.id}/upload/${safeName}` }, { transaction });
    for (const [slot, sensorId] of Object.entries(input.sensorSlots)) {
      await models.RunSensor.create({ runId: created.id, sensorId, slot }, { transaction });
    }
    await recordAudit(
      {
        workspaceId,
        actorId,
        action: "run.created",
        targetType: "run",
        targetId: created.id,
        detail: { vehicle: vehicle.name, file: input.fileName, powersMotors, safetyAcknowledged: acknowledged },
      },
      transaction,
    );
    return created;
  });
  const uploadUrl = await presignUpload(run.fileKey, "text/csv");
  return { run: (await getRunSummary(workspaceId, run.id))!, uploadUrl };
}

/**
 * The browser (or a script) says the file is in storage: check it is there and within limits,
 * read its header (the stored file decides whether it is a motor run, whatever was declared),
 * then queue version 1 for processing. A motor run never confirmed is refused and stays
 * waiting for its file; `safetyAcknowledged` confirms it with this call.
 */
export async function markUploaded(
  workspaceId: string,
  actorId: string,
  runId: string,
  options: { safetyAcknowledged?: boolean } = {},
): Promise<RunSummary> {
  const { sequelize, models } = db();
  const run = await models.Run.findOne({ where: { workspaceId, id: runId } });
  if (!run) throw new UserFacingError("Run not found.");
  if (run.status !== "awaiting-file") throw new UserFacingError("This run already has its file.");
  const size = await objectSize(run.fileKey);
  if (size === null)
    throw new UserFacingError("The file has not arrived in storage yet. Upload it to the URL you were given, then try again.");
  if (size > UPLOAD_LIMITS.maxBytes) {
    await run.update({
      status: "failed",
      error: { message: `The file is ${Math.round(size / 1048576)} MB; the limit is ${UPLOAD_LIMITS.maxBytes / 1048576} MB.` },
    });
    throw new UserFacingError("The file is larger than the limit.");
  }
  const motorColumns = await motorColumnsInStoredFile(run);
  const confirmedNow = options.safetyAcknowledged === true;
  await requireMotorConfirmation(run, motorColumns, confirmedNow);
  const version = await sequelize.transaction(async (transaction) => {
    const fresh = await models.Run.findByPk(run.id, { transaction, lock: true });
    if (!fresh || fresh.status !== "awaiting-file") throw new UserFacingError("This run already has its file.");
    const confirming = confirmedNow && !fresh.safetyAcknowledgedAt;
    await fresh.update(
      {
        status: "uploaded",
        fileSize: size,
        progress: 0,
        stage: "Queued",
        ...(motorColumns.length ? { powersMotors: true } : {}),
        ...(confirming ? { safetyAcknowledgedAt: new Date(), safetyAcknowledgedById: actorId } : {}),
      },
      { transaction },
    );
    if (confirming)
      await recordAudit(
        { workspaceId, actorId, action: "run.safety-acknowledged", targetType: "run", targetId: run.id, detail: { file: run.fileName } },
        transaction,
      );
    const created = await models.RunVersion.create(
      { runId: run.id, number: 1, modelChoice: run.modelChoice, site: run.site, requestedById: actorId },
      { transaction },
    );
    await fresh.update({ currentVersionId: created.id }, { transaction });
    return created;
  });
  await enqueueVersion(version.id);
  return (await getRunSummary(workspaceId, runId))!;
}

/** Queue a new version of a run with another model and/or site; earlier versions keep their results. */
export async function reprocessRun(
  workspaceId: string,
  actorId: string,
  runId: string,
  input: { model: ModelChoice; siteId?: string | null; safetyAcknowledged?: boolean },
): Promise<RunVersionSummary> {
  const { sequelize, models } = db();
  const run = await models.Run.findOne({ where: { workspaceId, id: runId } });
  if (!run) throw new UserFacingError("Run not found.");
  if (run.status === "awaiting-file") throw new UserFacingError("The run has no file yet.");
  let site: SiteSnapshot | null = run.site;
  if (input.siteId !== undefined) {
    const row = input.siteId ? await models.Site.findOne({ where: { workspaceId, id: input.siteId } }) : null;
    if (input.siteId && !row) throw new UserFacingError("That site is not in this workspace.", "siteId");
    site = row ? snapshotOf(row) : null;
  }
  // The stored file decides again: a motor run processed before this check existed is confirmed now.
  const motorColumns = await motorColumnsInStoredFile(run);
  const confirming = input.safetyAcknowledged === true && !run.safetyAcknowledgedAt;
  await requireMotorConfirmation(run, motorColumns, input.safetyAcknowledged === true);
  const version = await sequelize.transaction(async (transaction) => {
    const last = (await models.RunVersion.max("number", { where: { runId }, transaction })) as number | null;
    const created = await models.RunVersion.create(
      { runId, number: (last ?? 0) + 1, modelChoice: input.model, site, requestedById: actorId },
      { transaction },
    );
    await run.update(
      {
        status: "uploaded",
        progress: 0,
        stage: `Queued (version ${created.number})`,
        error: null,
        currentVersionId: created.id,
        ...(motorColumns.length ? { powersMotors: true } : {}),
        ...(confirming ? { safetyAcknowledgedAt: new Date(), safetyAcknowledgedById: actorId } : {}),
      },
      { transaction },
    );
    await recordAudit(
      {
        workspaceId,
        actorId,
        action: "run.reprocessed",
        targetType: "run",
        targetId: runId,
        detail: {
          version: created.number,
          model: input.model,
          site: site?.name ?? null,
          ...(confirming ? { safetyAcknowledged: true } : {}),
        },
      },
      transaction,
    );
    return created;
  });
  await enqueueVersion(version.id);
  return toVersion(version);
}

export async function getRunSummary(workspaceId: string, id: string): Promise<RunSummary | null> {
  const run = (await db().models.Run.findOne({ where: { workspaceId, id }, include: includes() })) as RunRow | null;
  return run ? toSummary(run) : null;
}

export async function getRunDetail(workspaceId: string, id: string): Promise<RunDetail | null> {
  const { models } = db();
  const run = (await models.Run.findOne({ where: { workspaceId, id }, include: includes() })) as RunRow | null;
  if (!run) return null;
  const [slots, versions] = await Promise.all([
    models.RunSensor.findAll({ where: { runId: id }, include: [{ model: models.Sensor, as: "sensor" }] }),
    models.RunVersion.findAll({ where: { runId: id }, order: [["number", "DESC"]], attributes: { exclude: ["results"] } }),
  ]);
  return {
    ...toSummary(run),
    vehicleKind: run.vehicle?.kind ?? "other",
    columnMapping: run.columnMapping,
    units: run.units,
    fileSha256: run.fileSha256 ?? null,
    sensors: slots
      .map((s) => {
        const sensor = (s as unknown as { sensor: Sensor }).sensor;
        return { slot: s.slot, sensorId: sensor.id, label: sensor.label, kind: sensor.kind, mountingRotation: sensor.mountingRotation };
      })
      .sort((a, b) => a.slot.localeCompare(b.slot)),
    versions: versions.map(toVersion),
    currentVersionId: run.currentVersionId ?? null,
    signedOffByName: run.signedOffBy?.name ?? null,
    signOffComment: run.signOffComment ?? null,
    signedOffVersionId: run.signedOffVersionId ?? null,
  };
}

/** The results of one version (the current one unless given), or null when not ready. */
export async function getRunResults(
  workspaceId: string,
  runId: string,
  versionId?: string,
): Promise<{ version: RunVersionSummary; results: Record<string, unknown> } | null> {
  const { models } = db();
  const run = await models.Run.findOne({ where: { workspaceId, id: runId }, attributes: ["id", "currentVersionId"] });
  if (!run) return null;
  const version = await models.RunVersion.findOne({ where: { runId, id: versionId ?? run.currentVersionId ?? "" } });
  if (!version || version.status !== "done" || !version.results) return null;
  return { version: toVersion(version), results: version.results };
}

export async function getRunFileKeys(
  workspaceId: string,
  runId: string,
): Promise<{ fileKey: string; fileName: string; samplesKey: string | null } | null> {
  const { models } = db();
  const run = await models.Run.findOne({ where: { workspaceId, id: runId } });
  if (!run || run.status === "awaiting-file") return null;
  const version = run.currentVersionId ? await models.RunVersion.findByPk(run.currentVersionId, { attributes: ["samplesKey"] }) : null;
  return { fileKey: run.fileKey, fileName: run.fileName, samplesKey: version?.samplesKey ?? null };
}

/** Soft delete: the run disappears from lists and pages; rows and files stay for the audit trail. */
export async function deleteRun(workspaceId: string, actorId: string, runId: string): Promise<boolean> {
  const run = await db().models.Run.findOne({ where: { workspaceId, id: runId } });
  if (!run) return false;
  if (run.signedOffAt) throw new UserFacingError("A signed-off run is part of the record and cannot be deleted.");
  await run.destroy();
  await recordAudit({ workspaceId, actorId, action: "run.deleted", targetType: "run", targetId: runId, detail: { file: run.fileName } });
  return true;
}

/** Who uploaded a run, for the builder's "own runs only" rule. */
export async function runOwnership(
  workspaceId: string,
  runId: string,
): Promise<{ createdById: string | null; sharedWithStudents: boolean } | null> {
  const run = await db().models.Run.findOne({ where: { workspaceId, id: runId }, attributes: ["uploadedById", "sharedWithStudents"] });
  return run ? { createdById: run.uploadedById, sharedWithStudents: run.sharedWithStudents } : null;
}

const SORT_COLUMNS: Record<RunListQuery["sort"], string> = {
  capturedOn: "captured_on",
  createdAt: "created_at",
  verdict: "verdict",
  coverageFraction: "coverage_fraction",
  residualRms: "residual_rms",
  fieldStrength: "field_strength",
  offsetNorm: "offset_norm",
  vehicle: "vehicle",
};

/** Runs of a workspace, filtered, sorted and paged in SQL. Students see only shared runs. */
export async function listRuns(
  workspaceId: string,
  query: RunListQuery,
  options: { sharedOnly?: boolean } = {},
): Promise<{ items: RunSummary[]; total: number }> {
  const { models, sequelize } = db();
  const where: WhereOptions<Run> = { workspaceId };
  const and: WhereOptions<Run>[] = [];
  if (options.sharedOnly) and.push({ sharedWithStudents: true });
  if (query.vehicleId) and.push({ vehicleId: query.vehicleId });
  if (query.verdict) and.push({ verdict: query.verdict });
  if (query.status) and.push({ status: query.status });
  if (query.uploaderId) and.push({ uploadedById: query.uploaderId });
  if (query.from) and.push({ capturedOn: { [Op.gte]: query.from } });
  if (query.to) and.push({ capturedOn: { [Op.lte]: query.to } });
  if (query.sensorId)
    and.push(
      sequelize.literal(
        `EXISTS (SELECT 1 FROM run_sensors rs WHERE rs.run_id = "Run".id AND rs.sensor_id = ${sequelize.escape(query.sensorId)})`,
      ) as unknown as WhereOptions<Run>,
    );
  if (query.search) {
    const like = `%${query.search.replace(/[%_\\]/g, "\\$&")}%`;
    and.push({
      [Op.or]: [{ title: { [Op.iLike]: like } }, { fileName: { [Op.iLike]: like } }, { "$vehicle.name$": { [Op.iLike]: like } }],
    } as WhereOptions<Run>);
  }
  if (and.length) Object.assign(where, { [Op.and]: and });
  const direction = query.order === "asc" ? "ASC NULLS LAST" : "DESC NULLS LAST";
  const sortBy = SORT_COLUMNS[query.sort];
  const order: Order = [
    [sortBy === "vehicle" ? sequelize.literal(`"vehicle"."name"`) : sequelize.literal(`"Run"."${sortBy}"`), direction],
    ["createdAt", "DESC"],
    ["id", "ASC"],
  ];
  const { rows, count } = await models.Run.findAndCountAll({
    where,
    include: includes(),
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
    distinct: true,
  });
  return { items: (rows as RunRow[]).map(toSummary), total: count };
}

/**
 * The latest earlier finished run that shares a magnetometer (or, failing that, any sensor)
 * with this one: what "the previous calibration of this sensor" means on the run page.
 */
export async function getPreviousRun(
  workspaceId: string,
  runId: string,
): Promise<{ run: RunSummary; results: Record<string, unknown>; slot: string; sensorId: string } | null> {
  const { models, sequelize } = db();
  const run = await models.Run.findOne({ where: { workspaceId, id: runId } });
  if (!run) return null;
  const slots = await models.RunSensor.findAll({ where: { runId }, order: [["slot", "ASC"]] });
  const ordered = [...slots].sort((a, b) => compareSlots(a.slot, b.slot));
  for (const slot of ordered) {
    const [rows] = (await sequelize.query(
      `SELECT r.id, rs.slot FROM runs r JOIN run_sensors rs ON rs.run_id = r.id
        WHERE r.workspace_id = :workspaceId AND rs.sensor_id = :sensorId AND r.id <> :runId AND r.deleted_at IS NULL
          AND r.status = 'done' AND (r.captured_on < :capturedOn OR (r.captured_on = :capturedOn AND r.created_at < :createdAt))
        ORDER BY r.captured_on DESC, r.created_at DESC LIMIT 1`,
      { replacements: { workspaceId, sensorId: slot.sensorId, runId, capturedOn: run.capturedOn, createdAt: run.createdAt } },
    )) as [{ id: string; slot: string }[], unknown];
    if (rows.length === 0) continue;
    const summary = await getRunSummary(workspaceId, rows[0].id);
    const results = await getRunResults(workspaceId, rows[0].id);
    if (summary && results) return { run: summary, results: results.results, slot: rows[0].slot, sensorId: slot.sensorId };
  }
  return null;
}
