"use client";

import { useState } from "react";
import { PendingButton, ProblemMessage, useApiForm } from "@/components/ui/api-form";
import { SelectField, TextField } from "@/components/ui/field";
import { IDENTITY_MOUNTING_ID, MOUNTING_ROTATIONS, eulerAnglesLine, mountingRotationById } from "@/geometry/mounting-rotations";
import { apiFetch } from "@/lib/api-client";
import type { SensorSummary } from "@/lib/data/sensors";
import { MountingPicture } from "./mounting-picture";
import { COMMON_MAGNETOMETER_RANGES_UT, DEFAULT_MAGNETOMETER_RANGE_UT } from "@/geometry/magnetometer-range";
import { ACCEL_UNITS, FIELD_UNITS, RATE_UNITS, SENSOR_KINDS, SENSOR_KIND_LABELS, type SensorKind } from "@/lib/fleet-terms";

const UNIT_LABELS: Record<string, string> = {
  uT: "µT (microtesla)",
  nT: "nT (nanotesla)",
  mG: "mG (milligauss)",
  G: "G (gauss)",
  "m/s2": "m/s²",
  g: "g (standard gravity)",
  "rad/s": "rad/s",
  "deg/s": "°/s",
  counts: "raw counts",
};
const UNITS_BY_KIND: Record<SensorKind, readonly string[]> = {
  magnetometer: FIELD_UNITS,
  accelerometer: ACCEL_UNITS,
  gyroscope: RATE_UNITS,
};

const KIND_OPTIONS = SENSOR_KINDS.map((k) => ({ value: k, label: SENSOR_KIND_LABELS[k] }));
const PLACEMENT_OPTIONS = [
  { value: "internal", label: "Internal: on the flight controller board" },
  { value: "external", label: "External: a separate module, e.g. on a mast" },
];
const MOUNTING_OPTIONS = MOUNTING_ROTATIONS.map((r) => ({
  value: r.id,
  label: r.id === IDENTITY_MOUNTING_ID ? `aligned with the vehicle: ${r.words}` : r.words,
}));

/** Add a sensor to a vehicle, or edit one when `sensor` is given. */
export function SensorForm({
  slug,
  vehicleId,
  sensor,
  onSaved,
  onCancel,
}: {
  slug: string;
  vehicleId: string;
  sensor?: SensorSummary;
  onSaved: (sensor: SensorSummary) => void;
  onCancel: () => void;
}) {
  const editing = sensor !== undefined;
  const [kind, setKind] = useState<SensorKind>(sensor?.kind ?? "magnetometer");
  const unitChoices = UNITS_BY_KIND[kind];
  const [units, setUnits] = useState(sensor && unitChoices.includes(sensor.units) ? sensor.units : unitChoices[0]);
  const [mountingId, setMountingId] = useState(sensor?.mountingRotation ?? IDENTITY_MOUNTING_ID);
  const mounting = mountingRotationById(mountingId);
  // A stored value that is none of the 48 still shows, so the form opens as saved and says why it is refused.
  const mountingOptions = mounting
    ? MOUNTING_OPTIONS
    : [{ value: mountingId, label: `“${mountingId}” (not one of the 48 mountings)` }, ...MOUNTING_OPTIONS];
  const { onSubmit, pending, problem, fieldError } = useApiForm(async (values) => {
    const body = {
      kind: values.kind,
      label: values.label,
      placement: values.placement,
      mountingRotation: values.mountingRotation,
      units: values.units,
      columnHints: values.columnHints ?? "",
      // Only a compass has a range here; empty means not stated.
      fullScaleRangeUt: values.kind === "magnetometer" ? (values.fullScaleRangeUt ?? "") : null,
    };
    const url = editing ? `/api/workspaces/${slug}/sensors/${sensor.id}` : `/api/workspaces/${slug}/vehicles/${vehicleId}/sensors`;
    return (await apiFetch<{ sensor: SensorSummary }>(url, { method: editing ? "PATCH" : "POST", json: body })).sensor;
  }, onSaved);
  const prefix = editing ? `sensor-${sensor.id.slice(0, 8)}` : "sensor-new";

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={editing ? `Edit ${sensor.label}` : "Add a sensor"}>
      <ProblemMessage problem={problem} />
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          id={`${prefix}-kind`}
          name="kind"
          label="Sensor"
          value={kind}
          onChange={(event) => {
            const next = event.target.value as SensorKind;
            setKind(next);
            setUnits(UNITS_BY_KIND[next][0]);
          }}
          options={KIND_OPTIONS}
          error={fieldError("kind")}
        />
        <TextField
          id={`${prefix}-label`}
          name="label"
          label="Label"
          defaultValue={sensor?.label}
          maxLength={80}
          hint="Your own name for it, e.g. “board” or “mast module”."
          error={fieldError("label")}
        />
        <SelectField
          id={`${prefix}-placement`}
          name="placement"
          label="Placement"
          defaultValue={sensor?.placement ?? "internal"}
          options={PLACEMENT_OPTIONS}
          error={fieldError("placement")}
        />
        <SelectField
          id={`${prefix}-units`}
          name="units"
          label="Units it logs in"
          value={units}
          onChange={(event) => setUnits(event.target.value)}
          options={unitChoices.map((u) => ({ value: u, label: UNIT_LABELS[u] ?? u }))}
          error={fieldError("units")}
        />
        {kind === "magnetometer" ? (
          <>
            <TextField
              id={`${prefix}-range`}
              name="fullScaleRangeUt"
              label="Full-scale range (± µT, each axis)"
              inputMode="decimal"
              list={`${prefix}-range-choices`}
              defaultValue={sensor?.fullScaleRangeUt ?? ""}
              placeholder={`${DEFAULT_MAGNETOMETER_RANGE_UT} if left empty`}
              hint={`From the compass's data sheet or its settings. Left empty, the checks assume ±${DEFAULT_MAGNETOMETER_RANGE_UT} µT, the common default, and say so. The offset is judged by how much of this range it leaves free.`}
              error={fieldError("fullScaleRangeUt")}
            />
            <datalist id={`${prefix}-range-choices`}>
              {COMMON_MAGNETOMETER_RANGES_UT.map((range) => (
                <option key={range} value={range} />
              ))}
            </datalist>
          </>
        ) : null}
      </div>
      <div className="flex flex-col gap-3 sm:flex-row sm:items-start">
        <div className="min-w-0 flex-1 space-y-1">
          <SelectField
            id={`${prefix}-mounting`}
            name="mountingRotation"
            label="Declared mounting"
            value={mountingId}
            onChange={(event) => setMountingId(event.target.value)}
            options={mountingOptions}
            error={fieldError("mountingRotation")}
            hint="Where the module's own x and z axes point on the vehicle (vehicle x forward, y right, z down). Declare how it is really fitted: a compass fitted one way and declared another points the heading the wrong way as the vehicle turns, which makes it circle and drift away."
          />
          {mounting ? (
            <p className="text-xs text-chart-muted" data-testid="mounting-euler">
              {eulerAnglesLine(mounting)}
            </p>
          ) : null}
        </div>
        <MountingPicture mountingId={mountingId} />
      </div>
      <TextField
        id={`${prefix}-columns`}
        name="columnHints"
        label="Usual CSV columns"
        defaultValue={sensor?.columnHints.join(", ")}
        placeholder="e.g. mag_x, mag_y, mag_z"
        hint="Separated by commas. The upload page uses them to match a file's columns to this sensor."
        error={fieldError("columnHints")}
      />
      <div className="flex flex-wrap gap-2">
        <PendingButton pending={pending}>{editing ? "Save the sensor" : "Add the sensor"}</PendingButton>
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
