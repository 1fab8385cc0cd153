"use client";

import { useRouter } from "next/navigation";
import { useState, type ReactNode } from "react";
import { VehicleForm } from "@/components/fleet/vehicle-form";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { VehicleSummary } from "@/lib/data/vehicles";
import { VEHICLE_KIND_LABELS } from "@/lib/fleet-terms";

function Detail({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div>
      <dt className="text-xs uppercase tracking-wide text-chart-muted">{term}</dt>
      <dd className="mt-0.5">{children || <span className="text-chart-muted">—</span>}</dd>
    </div>
  );
}

/** A vehicle's particulars, with edit and archive for those who may change it. */
export function VehicleDetails({ slug, vehicle, canEdit }: { slug: string; vehicle: VehicleSummary; canEdit: boolean }) {
  const router = useRouter();
  const [editing, setEditing] = useState(false);
  const [archiving, setArchiving] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  async function setArchived(archived: boolean) {
    if (archived && !window.confirm(`Archive ${vehicle.name}? It leaves the fleet list but keeps its sensors and runs.`)) return;
    setArchiving(true);
    setProblem(null);
    try {
      const { name, kind, airframe, serialTag, customer, notes } = vehicle;
      await apiFetch(`/api/workspaces/${slug}/vehicles/${vehicle.id}`, {
        method: "PATCH",
        json: { name, kind, airframe, serialTag, customer, notes, archived },
      });
      router.refresh();
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "The server could not be reached.");
    } finally {
      setArchiving(false);
    }
  }

  return (
    <section className="card p-6" aria-labelledby="vehicle-heading">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-xs font-semibold uppercase tracking-widest text-brass-600 dark:text-brass-300">
            {VEHICLE_KIND_LABELS[vehicle.kind]}
          </p>
          <h2 id="vehicle-heading" className="text-2xl font-semibold">
            {vehicle.name}
            {vehicle.archived ? (
              <span className="ml-3 rounded-full border border-chart-rule px-2 py-0.5 align-middle text-xs font-normal text-chart-muted">
                archived
              </span>
            ) : null}
          </h2>
        </div>
        {canEdit && !editing ? (
          <div className="flex gap-2">
            <button type="button" className="btn-quiet" onClick={() => setEditing(true)}>
              Edit details
            </button>
            <button type="button" className="btn-quiet" disabled={archiving} onClick={() => setArchived(!vehicle.archived)}>
              {vehicle.archived ? "Bring back to the fleet" : "Archive"}
            </button>
          </div>
        ) : null}
      </div>
      {problem ? (
        <p role="alert" className="mt-3 rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          {problem}
        </p>
      ) : null}
      {editing ? (
        <div className="mt-4">
          <VehicleForm
            slug={slug}
            vehicle={vehicle}
            onSaved={() => {
              setEditing(false);
              router.refresh();
            }}
            onCancel={() => setEditing(false)}
          />
        </div>
      ) : (
        <dl className="mt-4 grid gap-4 text-sm sm:grid-cols-2 lg:grid-cols-4">
          <Detail term="Airframe">{vehicle.airframe}</Detail>
          <Detail term="Serial or tag">{vehicle.serialTag ? <span className="font-mono">{vehicle.serialTag}</span> : null}</Detail>
          <Detail term="Owner or customer">{vehicle.customer}</Detail>
          <Detail term="Runs">
            {vehicle.runCount}
            {vehicle.lastCapturedOn ? <span className="text-chart-muted"> · last captured {vehicle.lastCapturedOn}</span> : null}
          </Detail>
          {vehicle.notes ? (
            <div className="sm:col-span-2 lg:col-span-4">
              <Detail term="Notes">
                <span className="whitespace-pre-line">{vehicle.notes}</span>
              </Detail>
            </div>
          ) : null}
        </dl>
      )}
    </section>
  );
}
