import crypto from "node:crypto";
import { Transform } from "node:stream";
import { convertCapture, type CaptureUnits } from "@/geometry/capture-units";
import { hasMotorFields } from "@/geometry/motor-safety";
import { buildRunView } from "@/geometry/run-view";
import { resolveThresholds } from "@/geometry/thresholds";
import { parseUnitForKind, type QuantityKind } from "@/geometry/units";
import type { CaptureField } from "@/geometry/types";
import { db } from "@/lib/db";
import { IngestError } from "@/lib/ingest/csv-table";
import { ingestCapture } from "@/lib/ingest/ingest-capture";
import { toJsonSafe } from "@/lib/jobs/results-json";
import { putObject, readObjectStream } from "@/lib/storage";
import type { RunError } from "@/models/run";

export type ProcessOutcome = "done" | "failed" | "skipped";

/** Test seam: lets a test stop the work between parsing and saving, as a crash would. */
export interface ProcessHooks {
  afterParse?: (versionId: string) => void | Promise<void>;
  /** Seconds spent reading (stream, parse), fitting, storing the samples and view, and recording the results. */
  timings?: (seconds: { read: number; fit: number; save: number; record: number }) => void;
}

function unitsOf(stored: Record<string, string>): CaptureUnits {
  const units: CaptureUnits = {};
  for (const [kind, text] of Object.entries(stored)) {
    const spec = parseUnitForKind(text, kind as QuantityKind);
    if (spec) (units as Record<string, unknown>)[kind] = spec;
  }
  return units;
}

/** Float32 column-major samples: every field's values in turn, little-endian. */
function packSamples(fields: CaptureField[], columns: Record<CaptureField, Float64Array>, length: number): Buffer {
  const buffer = Buffer.alloc(fields.length * length * 4);
  const view = new Float32Array(buffer.buffer, buffer.byteOffset, fields.length * length);
  fields.forEach((field, i) => view.set(columns[field], i * length));
  return buffer;
}

/**
 * Process one version of a run: stream the upload from storage, parse and validate it, fit
 * and check it, store the samples compactly and the results in one transaction.
 *
 * Idempotent: a version already done is skipped, and a retry after a crash starts over and
 * overwrites the same objects. A bad file is a final answer (status failed, with row and
 * column), not an error to retry; anything unexpected is thrown so the queue retries it.
 */
export async function processRunVersion(versionId: string, hooks: ProcessHooks = {}): Promise<ProcessOutcome> {
  const { sequelize, models } = db();
  const version = await models.RunVersion.findByPk(versionId);
  if (!version || version.status === "done" || version.status === "failed") return "skipped";
  const run = await models.Run.findByPk(version.runId, { paranoid: false });
  if (!run || run.deletedAt) return "skipped";

  await version.update({ status: "processing", attempts: version.attempts + 1, startedAt: new Date() });
  const isCurrent = () => run.currentVersionId === version.id;
  const setStage = async (stage: string, progress: number) => {
    if (isCurrent()) await models.Run.update({ status: "processing", stage, progress }, { where: { id: run.id } });
  };
  await setStage("Reading the file", 0.02);

  // Count bytes for progress and hash them for the record, as they stream past.
  const hash = crypto.createHash("sha256");
  let bytes = 0;
  let lastReport = 0;
  const meter = new Transform({
    transform(chunk: Buffer, _encoding, callback) {
      hash.update(chunk);
      bytes += chunk.length;
      const now = Date.now();
      if (now - lastReport > 500) {
        lastReport = now;
        void setStage("Reading the file", Math.min(0.6, 0.02 + 0.58 * (bytes / Math.max(run.fileSize, 1))));
      }
      callback(null, chunk);
    },
  });

  const slots = await models.RunSensor.findAll({ where: { runId: run.id }, include: [{ model: models.Sensor, as: "sensor" }] });
  const mountingRotations: Record<string, string> = {};
  const magnetometerRangesUt: Record<string, number> = {};
  for (const slot of slots) {
    const sensor = (slot as unknown as { sensor: { kind: string; mountingRotation: string; fullScaleRangeUt: number | null } }).sensor;
    if (sensor.kind !== "magnetometer") continue;
    mountingRotations[slot.slot] = sensor.mountingRotation;
    if (sensor.fullScaleRangeUt !== null) magnetometerRangesUt[slot.slot] = sensor.fullScaleRangeUt;
  }
  const site = version.site;

  // The same ingest as `npm run fit`: limits, capture date at noon UTC, units stated > named > guessed.
  const started = performance.now();
  let readDone = started;
  let ingested, analysis, common;
  let parsed = false;
  try {
    const source = await readObjectStream(run.fileKey);
    source.on("error", (error) => meter.destroy(error));
    ({
      ingested,
      analysis,
      document: common,
    } = await ingestCapture(
      source.pipe(meter),
      {
        map: run.columnMapping as Record<string, CaptureField | "ignore">,
        site: site ? { latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM } : null,
        capturedOn: run.capturedOn,
        units: unitsOf(run.units),
        model: version.modelChoice,
        mountingRotations,
        magnetometerRangesUt,
        seed: 1,
      },
      {
        afterParse: async () => {
          parsed = true;
          readDone = performance.now();
          await hooks.afterParse?.(versionId);
          await setStage("Fitting", 0.65);
        },
      },
    ));
  } catch (error) {
    if (error instanceof IngestError)
      return fail(versionId, { message: error.message, row: error.row ?? undefined, column: error.column ?? undefined });
    // Inputs the analysis refuses are a final answer too; a RangeError while reading is not.
    if (parsed && error instanceof RangeError) return fail(versionId, { message: error.message });
    throw error;
  }

  const fitDone = performance.now();
  await setStage("Saving", 0.9);
  const { table } = ingested;
  const samplesKey = `${run.fileKey.replace(/\/upload\/[^/]+$/, "")}/versions/${version.number}/samples.f32`;
  // The samples go to storage while the view is cut down: the store works on its own meanwhile.
  const samplesStored = putObject(samplesKey, packSamples(table.fields, table.columns, table.length));
  // What the run page draws, cut down here once rather than on every page view.
  const fieldBandPercent = resolveThresholds()["mag.field-vs-model"].warnAbove ?? 10;
  const view = buildRunView(convertCapture(table, analysis.units), analysis, { fieldBandPercent });
  const viewKey = samplesKey.replace(/samples\.f32$/, "view.json");
  await Promise.all([samplesStored, putObject(viewKey, JSON.stringify(toJsonSafe(view)), "application/json")]);
  const saveDone = performance.now();

  const first = analysis.magnetometers.find((m) => m.ok) ?? null;
  const offsetNorm = first?.offset ? Math.hypot(...first.offset) : null;
  // The common results document, then where the worker stored the samples and the view.
  const results = toJsonSafe({
    ...common,
    samples: {
      key: samplesKey,
      fields: table.fields,
      length: table.length,
      layout: "float32 little-endian, column-major, fields in order",
    },
    view: { key: viewKey, sampleCount: view.sampleCount, pointsShown: view.pointsShown },
  }) as Record<string, unknown>;

  const outcome = await sequelize.transaction(async (transaction) => {
    const fresh = await models.RunVersion.findByPk(versionId, { transaction, lock: true });
    if (!fresh || fresh.status === "done") return "skipped" as const;
    await fresh.update(
      { status: "done", results, samplesKey, verdict: analysis.verdict, error: null, finishedAt: new Date() },
      { transaction },
    );
    // A table with motor current or throttle is a motor run, however it got here (older data, an earlier check missed).
    if (hasMotorFields(table.fields) && !run.powersMotors) {
      await models.Run.update({ powersMotors: true }, { where: { id: run.id }, transaction, paranoid: false });
    }
    const current = await models.Run.findByPk(run.id, { transaction, lock: true, paranoid: false });
    if (current && current.currentVersionId === versionId) {
      await current.update(
        {
          status: "done",
          stage: "Ready",
          progress: 1,
          error: null,
          fileSha256: hash.digest("hex"),
          verdict: analysis.verdict,
          coverageFraction: first?.coverage?.fraction ?? null,
          residualRms: first?.residualRms ?? null,
          fieldStrength: first?.fieldStrength ?? null,
          offsetNorm,
          modelChoice: fresh.modelChoice,
          site: fresh.site,
        },
        { transaction },
      );
    }
    return "done" as const;
  });
  const seconds = (from: number, to: number) => (to - from) / 1000;
  hooks.timings?.({
    read: seconds(started, readDone),
    fit: seconds(readDone, fitDone),
    save: seconds(fitDone, saveDone),
    record: seconds(saveDone, performance.now()),
  });
  return outcome;
}

/** Record a final failure (a bad file); the original upload stays in storage. */
async function fail(versionId: string, error: RunError): Promise<ProcessOutcome> {
  const { sequelize, models } = db();
  await sequelize.transaction(async (transaction) => {
    const version = await models.RunVersion.findByPk(versionId, { transaction, lock: true });
    if (!version) return;
    await version.update({ status: "failed", error, results: null, finishedAt: new Date() }, { transaction });
    await models.Run.update(
      { status: "failed", stage: "Could not process", progress: 1, error },
      { where: { id: version.runId, currentVersionId: versionId }, transaction },
    );
  });
  return "failed";
}

/** After the queue gives up on a version (retries exhausted), say so on the run. */
export async function giveUp(versionId: string, reason: string): Promise<void> {
  await fail(versionId, { message: `Processing stopped after repeated errors: ${reason}` });
}
