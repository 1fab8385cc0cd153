"use client";

import { IDENTITY_MOUNTING_ID, mountingRotationById } from "@/geometry/mounting-rotations";
import { slotWords } from "@/geometry/sensor-slots";
import Link from "next/link";
import { FieldShell, SelectField, TextField } from "@/components/ui/field";
import type { SensorFamily } from "@/geometry/column-names";
import {
  MODEL_CHOICES,
  MODEL_CHOICE_LABELS,
  SENSOR_KIND_LABELS,
  VEHICLE_KIND_LABELS,
  type ModelChoice,
  type VehicleKind,
} from "@/lib/fleet-terms";
import type { SensorSummary } from "@/lib/data/sensors";
import type { SiteSummary } from "@/lib/data/sites";
import { FAMILY_KIND } from "./capture-mapping";

export interface VehicleChoice {
  id: string;
  name: string;
  kind: VehicleKind;
}

export interface CaptureDetailsValues {
  vehicleId: string;
  siteId: string;
  capturedOn: string;
  title: string;
  model: ModelChoice;
}

interface CaptureDetailsProps {
  slug: string;
  vehicles: VehicleChoice[];
  vehiclesTotal: number;
  sites: SiteSummary[];
  values: CaptureDetailsValues;
  onChange: <K extends keyof CaptureDetailsValues>(field: K, value: CaptureDetailsValues[K]) => void;
  slots: Record<SensorFamily, string[]>;
  slotSensors: Record<string, string>;
  onSlotChange: (slot: string, sensorId: string) => void;
  /** The chosen vehicle's sensors; undefined while they load. */
  sensors: SensorSummary[] | undefined;
  sensorsError: string | null;
  errors: Record<string, string>;
}

function sensorOption(sensor: SensorSummary): string {
  const mounting = mountingRotationById(sensor.mountingRotation);
  const how =
    sensor.mountingRotation === IDENTITY_MOUNTING_ID
      ? "aligned with the vehicle"
      : mounting
        ? `mounted ${mounting.shortWords}`
        : `mounted “${sensor.mountingRotation}” (not one of the 48)`;
  return `${sensor.label} — ${sensor.placement}, ${how}`;
}

/** Which vehicle, which of its sensors fill the file's slots, where, when, and which model. */
export function CaptureDetails(props: CaptureDetailsProps) {
  const { slug, vehicles, vehiclesTotal, sites, values, onChange, slots, slotSensors, onSlotChange, sensors, sensorsError, errors } = props;
  const allSlots = (["mag", "accel", "gyro"] as const).flatMap((family) => slots[family].map((slot) => ({ family, slot })));
  const site = sites.find((s) => s.id === values.siteId);
  return (
    <div className="space-y-5">
      <SelectField
        name="vehicleId"
        id="run-vehicle"
        label="Vehicle"
        value={values.vehicleId}
        onChange={(event) => onChange("vehicleId", event.target.value)}
        error={errors.vehicleId}
        options={[
          { value: "", label: "Choose the vehicle…" },
          ...vehicles.map((v) => ({ value: v.id, label: `${v.name} (${VEHICLE_KIND_LABELS[v.kind]})` })),
        ]}
        hint={
          vehicles.length === 0 ? (
            <>
              No vehicles yet:{" "}
              <Link className="link" href={`/w/${slug}/vehicles`}>
                add one in the fleet
              </Link>{" "}
              first.
            </>
          ) : vehiclesTotal > vehicles.length ? (
            `The first ${vehicles.length} of ${vehiclesTotal} vehicles, by name.`
          ) : undefined
        }
      />

      {values.vehicleId && allSlots.length > 0 ? (
        <fieldset className="space-y-3 rounded-lg border border-chart-rule p-4">
          <legend className="px-1 text-sm font-medium">Which sensor logged each set of columns</legend>
          {sensorsError ? (
            <p role="alert" className="text-sm text-halt dark:text-red-300">
              {sensorsError}
            </p>
          ) : null}
          {errors.sensorSlots ? (
            <p role="alert" className="text-sm font-medium text-halt dark:text-red-300">
              {errors.sensorSlots}
            </p>
          ) : null}
          <div className="grid gap-4 sm:grid-cols-2">
            {allSlots.map(({ family, slot }) => {
              const kind = FAMILY_KIND[family];
              const choices = (sensors ?? []).filter((s) => s.kind === kind);
              const id = `slot-${slot}`;
              const error = errors[`sensorSlots.${slot}`];
              const hint =
                sensors === undefined
                  ? "Loading the vehicle’s sensors…"
                  : choices.length === 0
                    ? `This vehicle has no ${SENSOR_KIND_LABELS[kind].toLowerCase()} registered; the run is checked without its declared mounting.`
                    : undefined;
              return (
                <FieldShell key={slot} id={id} label={`${slotWords(slot)} (columns ${slot}.x, .y, .z)`} error={error} hint={hint}>
                  <select
                    id={id}
                    className="field-input"
                    value={slotSensors[slot] ?? ""}
                    disabled={sensors === undefined}
                    aria-invalid={error ? true : undefined}
                    aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
                    onChange={(event) => onSlotChange(slot, event.target.value)}
                  >
                    <option value="">Not linked to a sensor</option>
                    {choices.map((sensor) => (
                      <option key={sensor.id} value={sensor.id}>
                        {sensorOption(sensor)}
                      </option>
                    ))}
                  </select>
                </FieldShell>
              );
            })}
          </div>
        </fieldset>
      ) : null}

      <div className="grid gap-5 sm:grid-cols-2">
        <SelectField
          name="siteId"
          id="run-site"
          label="Site"
          value={values.siteId}
          onChange={(event) => onChange("siteId", event.target.value)}
          error={errors.siteId}
          options={[
            { value: "", label: "No site" },
            ...sites.map((s) => ({ value: s.id, label: `${s.name} (${s.latitudeDeg.toFixed(3)}°, ${s.longitudeDeg.toFixed(3)}°)` })),
          ]}
          hint={
            site ? (
              `The World Magnetic Model and normal gravity are taken at ${site.name}, ${site.altitudeM} m.`
            ) : (
              <>
                Without a site the field strength and inclination are not compared with the World Magnetic Model.
                {sites.length === 0 ? (
                  <>
                    {" "}
                    <Link className="link" href={`/w/${slug}/sites`}>
                      Add a site
                    </Link>
                    .
                  </>
                ) : null}
              </>
            )
          }
        />
        <TextField
          name="capturedOn"
          id="run-captured-on"
          label="Capture date"
          type="date"
          required
          value={values.capturedOn}
          onChange={(event) => onChange("capturedOn", event.target.value)}
          error={errors.capturedOn}
          hint="The model’s field is taken for this date."
        />
        <TextField
          name="title"
          id="run-title"
          label="Title (optional)"
          maxLength={160}
          value={values.title}
          placeholder="After the mast was moved"
          onChange={(event) => onChange("title", event.target.value)}
          error={errors.title}
        />
        <SelectField
          name="model"
          id="run-model"
          label="Magnetometer model"
          value={values.model}
          onChange={(event) => onChange("model", event.target.value as ModelChoice)}
          error={errors.model}
          options={MODEL_CHOICES.map((m) => ({ value: m, label: MODEL_CHOICE_LABELS[m] }))}
          hint="Left to the data, the simplest model the samples support is chosen."
        />
      </div>
    </div>
  );
}
