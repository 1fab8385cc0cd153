"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { SensorForm } from "@/components/fleet/sensor-form";
import { EmptyState } from "@/components/ui/empty-state";
import { mountingRotationById } from "@/geometry/mounting-rotations";
import type { SensorSummary } from "@/lib/data/sensors";
import { SENSOR_KIND_LABELS } from "@/lib/fleet-terms";
import { TableHead } from "@/components/ui/table-head";
import { DEFAULT_MAGNETOMETER_RANGE_UT } from "@/geometry/magnetometer-range";

/** A compass's range as a person reads it, the default marked as such; other sensors have none here. */
function rangeWords(sensor: SensorSummary): string {
  if (sensor.kind !== "magnetometer") return "—";
  return sensor.fullScaleRangeUt !== null ? `±${sensor.fullScaleRangeUt} µT` : `±${DEFAULT_MAGNETOMETER_RANGE_UT} µT, the common default`;
}

/** A vehicle's sensors with their declared mounting; add and edit for those who may. */
export function SensorList({
  slug,
  vehicleId,
  sensors,
  canEdit,
}: {
  slug: string;
  vehicleId: string;
  sensors: SensorSummary[];
  canEdit: boolean;
}) {
  const router = useRouter();
  // "new" while adding, a sensor id while editing that sensor, null otherwise.
  const [open, setOpen] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const editing = sensors.find((s) => s.id === open);
  const done = (sensor: SensorSummary) => {
    setSaved(`${sensor.label} (${SENSOR_KIND_LABELS[sensor.kind].toLowerCase()}) saved.`);
    setOpen(null);
    router.refresh();
  };

  return (
    <section className="card overflow-hidden" aria-labelledby="sensors-heading">
      <div className="flex flex-wrap items-center justify-between gap-3 px-6 pt-6">
        <div>
          <h2 id="sensors-heading" className="text-lg font-semibold">
            Sensors
          </h2>
          <p className="text-sm text-chart-muted">Each compass needs its true mounting; the checks compare it with what the data shows.</p>
        </div>
        {canEdit && open !== "new" ? (
          <button type="button" className="btn-primary" onClick={() => setOpen("new")}>
            Add a sensor
          </button>
        ) : null}
      </div>
      {saved ? (
        <p role="status" className="mx-6 mt-4 rounded-lg border border-steady/30 bg-steady-soft px-3 py-2 text-sm">
          {saved}
        </p>
      ) : null}
      {sensors.length === 0 ? (
        <EmptyState title="No sensors declared">
          {canEdit
            ? "Add each magnetometer and accelerometer the vehicle logs, with how it is mounted, before uploading a run."
            : "Someone who may edit this vehicle declares its sensors here."}
        </EmptyState>
      ) : (
        <div className="mt-4 overflow-x-auto">
          <table className="w-full text-left text-sm" aria-label="Sensors">
            <TableHead
              columns={["Label", "Sensor", "Placement", "Mounting (module axis → vehicle)", "Units", "Range", "Usual columns"]}
              actions={canEdit}
            />
            <tbody className="divide-y divide-chart-rule">
              {sensors.map((s) => (
                <tr key={s.id} data-testid="sensor-row">
                  <td className="px-6 py-2.5 font-medium">{s.label}</td>
                  <td className="px-4 py-2.5">{SENSOR_KIND_LABELS[s.kind]}</td>
                  <td className="px-4 py-2.5">{s.placement === "external" ? "External" : "Internal"}</td>
                  <td className="px-4 py-2.5 text-xs" data-testid="sensor-mounting" data-mounting={s.mountingRotation}>
                    {mountingRotationById(s.mountingRotation)?.shortWords ?? `“${s.mountingRotation}” (not one of the 48)`}
                  </td>
                  <td className="px-4 py-2.5 font-mono text-xs">{s.units}</td>
                  <td
                    className={`px-4 py-2.5 text-xs ${s.kind === "magnetometer" && s.fullScaleRangeUt === null ? "text-chart-muted" : ""}`}
                    data-testid="sensor-range"
                  >
                    {rangeWords(s)}
                  </td>
                  <td className="px-4 py-2.5 font-mono text-xs text-chart-muted">
                    {s.columnHints.length ? s.columnHints.join(", ") : "—"}
                  </td>
                  {canEdit ? (
                    <td className="px-6 py-2.5 text-right">
                      <button
                        type="button"
                        className="text-xs font-semibold text-lox-600 hover:underline dark:text-lox-300"
                        onClick={() => setOpen(s.id)}
                        aria-label={`Edit ${s.label}`}
                      >
                        Edit
                      </button>
                    </td>
                  ) : null}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {canEdit && open ? (
        <div className="border-t border-chart-rule p-6">
          <h3 className="mb-4 text-base font-semibold">{editing ? `Edit ${editing.label}` : "Add a sensor"}</h3>
          <SensorForm key={open} slug={slug} vehicleId={vehicleId} sensor={editing} onSaved={done} onCancel={() => setOpen(null)} />
        </div>
      ) : (
        <div className="h-2" />
      )}
    </section>
  );
}
