"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { pageFrom, useSearchState } from "@/components/ui/use-search-state";
import { RUN_SORT_KEYS, runColumns } from "@/components/runs/run-columns";
import { RunFilters, type Choice } from "@/components/runs/run-filters";
import { isSettled } from "@/components/runs/run-status";
import { apiFetch, withQuery } from "@/lib/api-client";
import type { MemberSummary } from "@/lib/data/members";
import type { RunSummary } from "@/lib/data/runs";
import type { SensorSummary } from "@/lib/data/sensors";
import type { VehicleSummary } from "@/lib/data/vehicles";
import { SENSOR_KIND_LABELS, VERDICTS } from "@/lib/fleet-terms";
import { isRecordId } from "@/lib/ids";

const PAGE_SIZE = 25;
const POLL_MS = 2_000;
/** A run still waiting for its file after this long was most likely abandoned; it stops the polling. */
const ABANDONED_AFTER_MS = 30 * 60_000;
const DEFAULTS = {
  q: "",
  vehicle: "",
  sensor: "",
  verdict: "",
  uploader: "",
  from: "",
  to: "",
  sort: "capturedOn",
  order: "desc",
  page: "1",
};
const DATE = /^\d{4}-\d{2}-\d{2}$/;

interface RunPage {
  items: RunSummary[];
  total: number;
}

const onlyIf = (ok: boolean, value: string) => (ok ? value : undefined);

function stillMoving(run: RunSummary): boolean {
  if (isSettled(run.status)) return false;
  if (run.status === "awaiting-file") return Date.now() - Date.parse(run.createdAt) < ABANDONED_AFTER_MS;
  return true;
}

/**
 * Runs of the workspace, or of one vehicle when `vehicleId` is given: filtered, sorted and paged
 * by the server, with the filters in the address bar. While any run on the page is being
 * processed the page is asked again every two seconds.
 */
export function RunsTable({
  slug,
  canCreate,
  canListMembers,
  canViewVehicles,
  vehicleId,
}: {
  slug: string;
  canCreate: boolean;
  canListMembers: boolean;
  canViewVehicles: boolean;
  vehicleId?: string;
}) {
  const [state, update] = useSearchState(DEFAULTS);
  const [searchKey, setSearchKey] = useState(0);
  const vehicle = vehicleId ?? onlyIf(canViewVehicles && isRecordId(state.vehicle), state.vehicle);
  const sort = (RUN_SORT_KEYS as readonly string[]).includes(state.sort) ? state.sort : "capturedOn";
  const order = state.order === "asc" ? "asc" : "desc";
  const page = pageFrom(state.page);
  const request = {
    vehicleId: vehicle,
    sensorId: onlyIf(Boolean(vehicle) && isRecordId(state.sensor), state.sensor),
    verdict: onlyIf((VERDICTS as readonly string[]).includes(state.verdict), state.verdict),
    uploaderId: onlyIf(canListMembers && isRecordId(state.uploader), state.uploader),
    from: onlyIf(DATE.test(state.from), state.from),
    to: onlyIf(DATE.test(state.to), state.to),
    search: state.q || undefined,
    sort,
    order,
    page,
    pageSize: PAGE_SIZE,
  };
  const runs = useQuery({
    queryKey: ["runs", slug, request],
    queryFn: () => apiFetch<RunPage>(withQuery(`/api/workspaces/${slug}/runs`, request)),
    placeholderData: keepPreviousData,
    refetchInterval: (query) => (query.state.data?.items.some(stillMoving) ? POLL_MS : false),
  });

  const vehicles = useQuery({
    queryKey: ["vehicles", slug, "choices"],
    queryFn: () =>
      apiFetch<{ items: VehicleSummary[] }>(withQuery(`/api/workspaces/${slug}/vehicles`, { archived: "include", pageSize: 100 })),
    enabled: canViewVehicles && !vehicleId,
    staleTime: 60_000,
  });
  const sensors = useQuery({
    queryKey: ["sensors", slug, vehicle],
    queryFn: () => apiFetch<{ sensors: SensorSummary[] }>(`/api/workspaces/${slug}/vehicles/${vehicle}/sensors`),
    enabled: canViewVehicles && Boolean(vehicle),
    staleTime: 60_000,
  });
  const members = useQuery({
    queryKey: ["members", slug],
    queryFn: () => apiFetch<{ members: MemberSummary[] }>(`/api/workspaces/${slug}/members`),
    enabled: canListMembers,
    staleTime: 60_000,
  });

  const vehicleChoices: Choice[] | null =
    canViewVehicles && !vehicleId
      ? (vehicles.data?.items.map((v) => ({ value: v.id, label: v.archived ? `${v.name} (archived)` : v.name })) ?? [])
      : null;
  const sensorChoices: Choice[] | null =
    canViewVehicles && vehicle
      ? (sensors.data?.sensors.map((s) => ({ value: s.id, label: `${s.label} · ${SENSOR_KIND_LABELS[s.kind].toLowerCase()}` })) ?? [])
      : null;
  const uploaderChoices: Choice[] | null = canListMembers
    ? (members.data?.members.map((m) => ({ value: m.userId, label: m.name })) ?? [])
    : null;

  const columns = useMemo(
    () => runColumns({ slug, showVehicle: !vehicleId, linkVehicles: canViewVehicles }),
    [slug, vehicleId, canViewVehicles],
  );
  const filtered = Boolean(
    state.q || (!vehicleId && state.vehicle) || state.sensor || state.verdict || state.uploader || state.from || state.to,
  );
  const clearFilters = () => {
    update({ q: "", vehicle: "", sensor: "", verdict: "", uploader: "", from: "", to: "" });
    setSearchKey((k) => k + 1);
  };
  const startHref = vehicleId ? `/w/${slug}/runs/new?vehicle=${vehicleId}` : `/w/${slug}/runs/new`;

  return (
    <section className="card overflow-hidden" aria-labelledby="runs-heading">
      <div className="flex flex-wrap items-center justify-between gap-3 px-4 pb-3 pt-5 sm:px-6">
        <h2 id="runs-heading" className="text-lg font-semibold">
          {vehicleId ? "Runs of this vehicle" : "Runs"}
          {runs.data ? (
            <span className="ml-2 font-mono text-sm font-normal text-chart-muted" data-testid="runs-total">
              {runs.data.total}
            </span>
          ) : null}
        </h2>
        {canCreate ? (
          <Link href={startHref} className="btn-primary">
            Start a run
          </Link>
        ) : null}
      </div>
      <RunFilters
        values={{
          q: state.q,
          vehicle: state.vehicle,
          sensor: state.sensor,
          verdict: state.verdict,
          uploader: state.uploader,
          from: state.from,
          to: state.to,
        }}
        onChange={update}
        vehicles={vehicleChoices}
        sensors={sensorChoices}
        uploaders={uploaderChoices}
        searchKey={searchKey}
      />
      <DataTable
        label={vehicleId ? "Runs of this vehicle" : "Runs"}
        columns={columns}
        rows={runs.data?.items}
        total={runs.data?.total ?? 0}
        getRowId={(r) => r.id}
        sort={{ id: sort, desc: order === "desc" }}
        onSortChange={(s) => update({ sort: s.id, order: s.desc ? "desc" : "asc" })}
        page={page}
        pageSize={PAGE_SIZE}
        onPageChange={(p) => update({ page: String(p) })}
        refreshing={runs.isPlaceholderData}
        error={runs.error ? runs.error.message : null}
        rowTestId="run-row"
        empty={
          filtered ? (
            <EmptyState
              title="No run matches these filters"
              action={
                <button type="button" className="btn-quiet" onClick={clearFilters}>
                  Clear the filters
                </button>
              }
            >
              Widen the dates, pick another verdict, or search for fewer words.
            </EmptyState>
          ) : canCreate ? (
            <EmptyState
              title="No runs yet"
              action={
                <Link href={startHref} className="btn-primary">
                  Start a run
                </Link>
              }
            >
              Start a run to upload the samples logged during a calibration; the server fits them and checks every result.
            </EmptyState>
          ) : (
            <EmptyState title="No runs to show yet">
              {canViewVehicles
                ? "Runs appear here once a technician, a builder or an owner uploads a calibration."
                : "Runs your instructor shares with the class appear here."}
            </EmptyState>
          )
        }
      />
    </section>
  );
}
