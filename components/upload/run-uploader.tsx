"use client";

import { useQuery } from "@tanstack/react-query";
import { useMemo, useRef, useState, type FormEvent } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { SensorSummary } from "@/lib/data/sensors";
import type { SiteSummary } from "@/lib/data/sites";
import {
  firstNonNumbers,
  recognisedMapping,
  reviewMapping,
  suggestSlotSensors,
  type ColumnMapping,
  type UnitQuantity,
} from "./capture-mapping";
import { CaptureDetails, type CaptureDetailsValues, type VehicleChoice } from "./capture-details";
import { ColumnSection } from "./column-section";
import { FileDrop, refuseFile } from "./file-drop";
import { MotorSafety } from "./motor-safety";
import type { FilePreview } from "./preview-types";
import { readPreview } from "./read-preview";
import { RunProgress } from "./run-progress";
import { checkRunForm, localToday, runRequestBody, unplacedErrors, type RunFormValues } from "./run-request";
import { useRunUpload } from "./use-run-upload";

const NO_SENSORS: SensorSummary[] = [];

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
  const pickCount = useRef(0);
  const upload = useRunUpload(slug, resumeRunId);
  const { phase } = upload;

  const vehicle = useQuery({
    queryKey: ["vehicle", slug, details.vehicleId],
    queryFn: () => apiFetch<{ sensors: SensorSummary[] }>(`/api/workspaces/${slug}/vehicles/${details.vehicleId}`),
    enabled: details.vehicleId !== "",
  });
  const sensors = details.vehicleId ? vehicle.data?.sensors : NO_SENSORS;

  // What the form shows is derived from the file and the person's choices; only overrides are kept in state.
  const review = useMemo(() => (preview ? reviewMapping(preview.headers, mapping) : null), [preview, mapping]);
  const nonNumbers = useMemo(() => (preview ? firstNonNumbers(preview.headers, preview.rows, mapping) : {}), [preview, mapping]);
  const suggestedSlots = useMemo(
    () => (review ? suggestSlotSensors(review.slots, review.columnsBySlot, sensors ?? []) : {}),
    [review, sensors],
  );
  const slotSensors = { ...suggestedSlots, ...slotChoices };
  const units: Partial<Record<UnitQuantity, string>> = {};
  for (const quantity of review?.quantities ?? []) units[quantity] = unitChoices[quantity] ?? review?.unitHints[quantity] ?? "";
  const powersMotors = motorsTicked || Boolean(review?.hasMotorColumn);

  function clearChoices() {
    setPreview(null);
    setPreviewError(null);
    setMapping({});
    setUnitChoices({});
    setSlotChoices({});
    setErrors({});
    setFormError(null);
  }

  function takeFile(picked: File) {
    const refusal = refuseFile(picked);
    pickCount.current += 1;
    setFile(refusal ? null : picked);
    setFileError(refusal ?? undefined);
    clearChoices();
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

  async function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form: RunFormValues = {
      file,
      preview,
      previewError,
      review,
      mapping,
      units,
      slotSensors,
      ...details,
      powersMotors,
      acknowledged,
    };
    const found = checkRunForm(form);
    setErrors(found);
    if (Object.keys(found).length > 0 || !file || !preview) {
      setFormError("Some things need attention before the upload; each is marked where it is.");
      return;
    }
    setFormError(null);
    const refusal = await upload.start(runRequestBody({ ...form, file, preview }), file);
    if (refusal instanceof ApiError) {
      setErrors(refusal.fields);
      // The server found a motor run the form did not: open the cautions, where its reason is shown.
      if (refusal.fields.safetyAcknowledged) setMotorsTicked(true);
      setFormError([refusal.message, ...unplacedErrors(refusal.fields)].join(" "));
    } else if (refusal) setFormError("The server could not be reached. Check the connection and try again.");
  }

  function startOver() {
    upload.reset();
    pickCount.current += 1;
    setFile(null);
    setFileError(undefined);
    clearChoices();
    setMotorsTicked(false);
    setAcknowledged(false);
    setDetails((current) => ({ ...current, title: "" }));
  }

  if (phase.kind === "sending" || phase.kind === "processing") {
    return (
      <RunProgress
        slug={slug}
        runId={phase.runId}
        fileName={phase.fileName}
        // A resumed run (no file name) may belong to another vehicle than the form's: its own kind is read with it.
        vehicleKind={phase.fileName === null ? null : vehicles.find((v) => v.id === details.vehicleId)?.kind}
        transfer={phase.transfer}
        onRetry={phase.kind === "sending" && file ? () => upload.retry(file) : undefined}
        onCancel={
          phase.kind === "sending"
            ? () => void upload.cancel().then(() => setFormError("The upload was cancelled; nothing was kept."))
            : undefined
        }
        onStartOver={startOver}
      />
    );
  }

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
          <ColumnSection
            preview={preview}
            previewError={previewError}
            review={review}
            mapping={mapping}
            onMappingChange={(header, choice) => setMapping((current) => ({ ...current, [header]: choice }))}
            nonNumbers={nonNumbers}
            units={units}
            onUnitChange={(quantity, value) => setUnitChoices((current) => ({ ...current, [quantity]: value }))}
            errors={errors}
          />
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
            vehicleKind={vehicles.find((v) => v.id === details.vehicleId)?.kind ?? null}
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
