"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect, useMemo, useRef, useState, type FormEvent } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { SensorSummary } from "@/lib/data/sensors";
import type { SiteSummary } from "@/lib/data/sites";
import { UPLOAD_LIMITS } from "@/lib/fleet-terms";
import {
  firstNonNumbers,
  recognisedMapping,
  reviewMapping,
  suggestSlotSensors,
  type ColumnChoice,
  type ColumnMapping,
  type UnitQuantity,
} from "./capture-mapping";
import { CaptureDetails, type CaptureDetailsValues, type VehicleChoice } from "./capture-details";
import { FileDrop, refuseFile } from "./file-drop";
import { MotorSafety } from "./motor-safety";
import { PreviewTable } from "./preview-table";
import type { FilePreview } from "./preview-types";
import { putFile, type FileTransfer, type UploadTicket } from "./put-file";
import { readPreview } from "./read-preview";
import { RunProgress, type TransferState } from "./run-progress";
import { UnitFields } from "./unit-fields";

type Phase =
  | { kind: "form" }
  | { kind: "creating" }
  | { kind: "sending"; runId: string; fileName: string; transfer: TransferState; retry: "put" | "confirm" | null }
  | { kind: "processing"; runId: string; fileName: string | null; transfer: TransferState | null };

interface CreateRunReply {
  run: { id: string };
  upload: UploadTicket;
}

/** Error keys the form shows beside a field; any other key from the API goes in the summary. */
const PLACED_KEYS =
  /^(vehicleId|siteId|capturedOn|title|model|safetyAcknowledged|fileName|fileSize|sensorSlots(\..*)?|units\.\w+|columnMapping(\..*)?)$/;

const NO_SENSORS: SensorSummary[] = [];
/** Longest column name the API takes in a mapping. */
const MAX_COLUMN_NAME = 120;

/** Today in the browser's own time zone, as YYYY-MM-DD. */
function localToday(): string {
  const now = new Date();
  return `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, "0")}-${String(now.getDate()).padStart(2, "0")}`;
}

/**
 * Every column's meaning, stated, so the server reads the file as previewed. A left-out column
 * whose name is longer than the API accepts as a key is not listed: nothing would read it anyway.
 */
function explicitMapping(headers: string[], mapping: ColumnMapping): ColumnMapping {
  const stated: ColumnMapping = {};
  for (const header of headers) {
    const choice = mapping[header] ?? "ignore";
    if (choice !== "ignore" || header.length <= MAX_COLUMN_NAME) stated[header] = choice;
  }
  return stated;
}

function positiveScale(unit: string): boolean {
  if (!unit.startsWith("counts:")) return true;
  const scale = Number(unit.slice("counts:".length));
  return Number.isFinite(scale) && scale > 0;
}

/**
 * Starts a run: pick a file, check its preview and mapping, say which vehicle, sensors, site
 * and date, then upload straight to storage and follow the processing to its verdict. The
 * run id goes into the address (`?run=`), so a reload picks up the progress again.
 */
export function RunUploader({
  slug,
  vehicles,
  vehiclesTotal,
  initialVehicleId,
  sites,
  resumeRunId,
}: {
  slug: string;
  vehicles: VehicleChoice[];
  vehiclesTotal: number;
  /** Chosen beforehand, when the page is opened from a vehicle. */
  initialVehicleId: string | null;
  sites: SiteSummary[];
  resumeRunId: string | null;
}) {
  const api = `/api/workspaces/${slug}`;
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | undefined>();
  const [preview, setPreview] = useState<FilePreview | null>(null);
  const [previewError, setPreviewError] = useState<string | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [unitChoices, setUnitChoices] = useState<Partial<Record<UnitQuantity, string>>>({});
  const [details, setDetails] = useState<CaptureDetailsValues>(() => ({
    vehicleId: initialVehicleId ?? (vehicles.length === 1 ? vehicles[0].id : ""),
    // No site unless one is chosen: a wrong site would fail a sound calibration against the wrong field.
    siteId: "",
    capturedOn: localToday(),
    title: "",
    model: "auto",
  }));
  const [slotChoices, setSlotChoices] = useState<Record<string, string>>({});
  const [motorsTicked, setMotorsTicked] = useState(false);
  const [acknowledged, setAcknowledged] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [phase, setPhase] = useState<Phase>(
    resumeRunId ? { kind: "processing", runId: resumeRunId, fileName: null, transfer: null } : { kind: "form" },
  );
  const pickCount = useRef(0);
  const ticket = useRef<UploadTicket | null>(null);
  const transfer = useRef<FileTransfer | null>(null);

  const vehicle = useQuery({
    queryKey: ["vehicle", slug, details.vehicleId],
    queryFn: () => apiFetch<{ sensors: SensorSummary[] }>(`${api}/vehicles/${details.vehicleId}`),
    enabled: details.vehicleId !== "",
  });
  const sensors = details.vehicleId ? vehicle.data?.sensors : NO_SENSORS;

  const review = useMemo(() => (preview ? reviewMapping(preview.headers, mapping) : null), [preview, mapping]);
  const nonNumbers = useMemo(() => (preview ? firstNonNumbers(preview.headers, preview.rows, mapping) : {}), [preview, mapping]);
  const suggestedSlots = useMemo(
    () => (review ? suggestSlotSensors(review.slots, review.columnsBySlot, sensors ?? []) : {}),
    [review, sensors],
  );
  const slotSensors = { ...suggestedSlots, ...slotChoices };
  const currentSlots = review ? [...review.slots.mag, ...review.slots.accel, ...review.slots.gyro] : [];
  const units: Partial<Record<UnitQuantity, string>> = {};
  for (const quantity of review?.quantities ?? []) units[quantity] = unitChoices[quantity] ?? review?.unitHints[quantity] ?? "";
  const powersMotors = motorsTicked || Boolean(review?.hasMotorColumn);

  // Leaving the page mid-upload would lose the file's way to storage; the browser asks first.
  const sending = phase.kind === "sending" && phase.transfer.state === "sending";
  useEffect(() => {
    if (!sending) return;
    const warn = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [sending]);

  function takeFile(picked: File) {
    const refusal = refuseFile(picked);
    pickCount.current += 1;
    setFile(refusal ? null : picked);
    setFileError(refusal ?? undefined);
    setPreview(null);
    setPreviewError(null);
    setMapping({});
    setUnitChoices({});
    setSlotChoices({});
    setErrors({});
    setFormError(null);
    if (refusal) return;
    const token = pickCount.current;
    readPreview(picked).then(
      (read) => {
        if (token !== pickCount.current) return;
        setPreview(read);
        setMapping(recognisedMapping(read.headers));
      },
      (error: Error) => {
        if (token === pickCount.current) setPreviewError(error.message);
      },
    );
  }

  function changeDetail<K extends keyof CaptureDetailsValues>(field: K, value: CaptureDetailsValues[K]) {
    setDetails((current) => ({ ...current, [field]: value }));
    if (field === "vehicleId") setSlotChoices({});
    setErrors(({ [field]: _dropped, ...rest }) => rest);
  }

  function checkForm(): Record<string, string> {
    const found: Record<string, string> = {};
    if (!file) found.fileName = "Choose the capture file first.";
    else if (!preview) found.fileName = previewError ?? "The preview is still being read; wait a moment.";
    else if (preview.headers.length > UPLOAD_LIMITS.maxColumns)
      found.fileName = `The file has ${preview.headers.length} columns; the limit is ${UPLOAD_LIMITS.maxColumns}.`;
    if (review && review.problems.length > 0) found.columnMapping = review.problems[0];
    for (const header of preview?.headers ?? []) {
      if (header.length > MAX_COLUMN_NAME && (mapping[header] ?? "ignore") !== "ignore") {
        found[`columnMapping.${header}`] =
          `Only columns with names up to ${MAX_COLUMN_NAME} characters can be mapped; shorten this one in the file.`;
      }
    }
    if (!details.vehicleId) found.vehicleId = "Choose the vehicle this capture comes from.";
    if (!/^\d{4}-\d{2}-\d{2}$/.test(details.capturedOn)) found.capturedOn = "Give the capture date.";
    for (const [quantity, unit] of Object.entries(units)) {
      if (!positiveScale(unit)) found[`units.${quantity}`] = "Give the scale per count as a positive number, such as 0.15.";
    }
    if (powersMotors && !acknowledged) found.safetyAcknowledged = "This capture powers the motors: confirm the cautions before uploading.";
    return found;
  }

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const found = checkForm();
    setErrors(found);
    if (Object.keys(found).length > 0 || !file || !preview) {
      setFormError("Some things need attention before the upload; each is marked where it is.");
      return;
    }
    setFormError(null);
    setPhase({ kind: "creating" });
    let created: CreateRunReply;
    try {
      created = await apiFetch<CreateRunReply>(`${api}/runs`, {
        method: "POST",
        json: {
          vehicleId: details.vehicleId,
          siteId: details.siteId || null,
          capturedOn: details.capturedOn,
          title: details.title.trim(),
          fileName: file.name,
          fileSize: file.size,
          columnMapping: explicitMapping(preview.headers, mapping),
          units: Object.fromEntries(Object.entries(units).filter(([, unit]) => unit !== "")),
          sensorSlots: Object.fromEntries(currentSlots.filter((slot) => slotSensors[slot]).map((slot) => [slot, slotSensors[slot]])),
          model: details.model,
          powersMotors,
          safetyAcknowledged: powersMotors && acknowledged,
        },
      });
    } catch (error) {
      setPhase({ kind: "form" });
      if (error instanceof ApiError) {
        setErrors(error.fields);
        const unplaced = Object.entries(error.fields).filter(([key]) => !PLACED_KEYS.test(key));
        setFormError([error.message, ...unplaced.map(([key, message]) => `${key}: ${message}`)].join(" "));
      } else setFormError("The server could not be reached. Check the connection and try again.");
      return;
    }
    ticket.current = created.upload;
    send(created.run.id, file);
  }

  function send(runId: string, picked: File) {
    const progress = (sentBytes: number, totalBytes: number) =>
      setPhase((current) =>
        current.kind === "sending" && current.runId === runId
          ? { ...current, transfer: { sentBytes, totalBytes, state: "sending" } }
          : current,
      );
    setPhase({
      kind: "sending",
      runId,
      fileName: picked.name,
      transfer: { sentBytes: 0, totalBytes: picked.size, state: "sending" },
      retry: null,
    });
    const started = putFile(ticket.current!, picked, progress);
    transfer.current = started;
    started.done.then(
      () => markUploaded(runId, picked),
      (error: Error) => {
        if (error.name === "AbortError") return;
        setPhase((current) =>
          current.kind === "sending"
            ? {
                ...current,
                transfer: { ...current.transfer, state: "stalled", message: `${error.message} The run is kept; try again.` },
                retry: "put",
              }
            : current,
        );
      },
    );
  }

  async function markUploaded(runId: string, picked: File) {
    const sent: TransferState = { sentBytes: picked.size, totalBytes: picked.size, state: "sent" };
    try {
      await apiFetch(`${api}/runs/${runId}/uploaded`, { method: "POST" });
    } catch (error) {
      const message = error instanceof ApiError ? error.message : "The server could not be reached to start the processing.";
      setPhase({ kind: "sending", runId, fileName: picked.name, transfer: { ...sent, state: "stalled", message }, retry: "confirm" });
      return;
    }
    window.history.replaceState(null, "", `?run=${runId}`);
    setPhase({ kind: "processing", runId, fileName: picked.name, transfer: sent });
  }

  async function cancel(runId: string) {
    transfer.current?.abort();
    // The run never got its file; it is removed so it does not linger in the list.
    await apiFetch(`${api}/runs/${runId}`, { method: "DELETE" }).catch(() => undefined);
    setPhase({ kind: "form" });
    setFormError("The upload was cancelled; nothing was kept.");
  }

  function startOver() {
    window.history.replaceState(null, "", window.location.pathname);
    pickCount.current += 1;
    setFile(null);
    setFileError(undefined);
    setPreview(null);
    setPreviewError(null);
    setMapping({});
    setUnitChoices({});
    setSlotChoices({});
    setMotorsTicked(false);
    setAcknowledged(false);
    setErrors({});
    setFormError(null);
    setDetails((current) => ({ ...current, title: "" }));
    setPhase({ kind: "form" });
  }

  if (phase.kind === "sending" || phase.kind === "processing") {
    const { runId } = phase;
    return (
      <RunProgress
        slug={slug}
        runId={runId}
        fileName={phase.fileName}
        transfer={phase.transfer}
        onRetry={
          phase.kind === "sending" && file
            ? () => (phase.retry === "confirm" ? void markUploaded(runId, file) : send(runId, file))
            : undefined
        }
        onCancel={phase.kind === "sending" ? () => void cancel(runId) : undefined}
        onStartOver={startOver}
      />
    );
  }

  const columnErrors: Record<string, string> = { ...review?.columnProblems };
  for (const [key, message] of Object.entries(errors))
    if (key.startsWith("columnMapping.")) columnErrors[key.slice("columnMapping.".length)] = message;

  return (
    <form onSubmit={submit} noValidate aria-label="Start a run" className="space-y-6">
      {formError ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm" data-testid="form-error">
          {formError}
        </p>
      ) : null}

      <section className="card space-y-4 p-6" aria-labelledby="file-heading">
        <h2 id="file-heading" className="text-lg font-semibold">
          1. The capture file
        </h2>
        <FileDrop file={file} error={fileError ?? errors.fileName ?? errors.fileSize} onFile={takeFile} />
      </section>

      {file ? (
        <section className="card space-y-4 p-6" aria-labelledby="preview-heading">
          <h2 id="preview-heading" className="text-lg font-semibold">
            2. What each column holds
          </h2>
          {previewError ? (
            <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
              {previewError}
            </p>
          ) : !preview || !review ? (
            <p role="status" className="text-sm text-chart-muted">
              Reading the first rows…
            </p>
          ) : (
            <>
              <PreviewTable
                preview={preview}
                mapping={mapping}
                onChange={(header: string, choice: ColumnChoice) => setMapping((m) => ({ ...m, [header]: choice }))}
                columnErrors={columnErrors}
                nonNumbers={nonNumbers}
              />
              {review.problems.length > 0 ? (
                <ul
                  role="alert"
                  className="space-y-1 rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm"
                  data-testid="mapping-problems"
                >
                  {review.problems.map((problem) => (
                    <li key={problem}>{problem}</li>
                  ))}
                </ul>
              ) : null}
              {errors.columnMapping && review.problems.length === 0 ? (
                <p role="alert" className="text-sm font-medium text-halt dark:text-red-300">
                  {errors.columnMapping}
                </p>
              ) : null}
              <h3 className="pt-2 font-semibold">Units as logged</h3>
              <UnitFields
                quantities={review.quantities}
                values={units}
                hints={review.unitHints}
                errors={errors}
                onChange={(quantity, value) => setUnitChoices((current) => ({ ...current, [quantity]: value }))}
              />
            </>
          )}
        </section>
      ) : null}

      {file ? (
        <section className="card space-y-4 p-6" aria-labelledby="details-heading">
          <h2 id="details-heading" className="text-lg font-semibold">
            3. Vehicle, place and date
          </h2>
          <CaptureDetails
            slug={slug}
            vehicles={vehicles}
            vehiclesTotal={vehiclesTotal}
            sites={sites}
            values={details}
            onChange={changeDetail}
            slots={review?.slots ?? { mag: [], accel: [], gyro: [] }}
            slotSensors={slotSensors}
            onSlotChange={(slot, sensorId) => setSlotChoices((current) => ({ ...current, [slot]: sensorId }))}
            sensors={sensors}
            sensorsError={vehicle.error ? `The vehicle’s sensors could not be loaded: ${vehicle.error.message}` : null}
            errors={errors}
          />
          <MotorSafety
            powersMotors={powersMotors}
            fromColumns={Boolean(review?.hasMotorColumn)}
            acknowledged={acknowledged}
            error={errors.safetyAcknowledged}
            onPowersMotors={setMotorsTicked}
            onAcknowledged={(value) => {
              setAcknowledged(value);
              if (value) setErrors(({ safetyAcknowledged: _dropped, ...rest }) => rest);
            }}
          />
        </section>
      ) : null}

      {file ? (
        <div className="flex flex-wrap items-center gap-4">
          <button type="submit" className="btn-primary" disabled={phase.kind === "creating"} aria-busy={phase.kind === "creating"}>
            {phase.kind === "creating" ? "Registering the run…" : "Upload and check"}
          </button>
          <p className="text-xs text-chart-muted">
            The file goes straight to storage; the fit runs on the server and this page follows it.
          </p>
        </div>
      ) : null}
    </form>
  );
}
