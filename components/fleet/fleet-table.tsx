"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { columnHelperFor, DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { SearchInput } from "@/components/ui/search-input";
import { pageFrom, useSearchState } from "@/components/ui/use-search-state";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { apiFetch, withQuery } from "@/lib/api-client";
import type { VehicleSummary } from "@/lib/data/vehicles";
import { VEHICLE_KINDS, VEHICLE_KIND_LABELS, type VehicleKind } from "@/lib/fleet-terms";

const PAGE_SIZE = 25;
const DEFAULTS = { q: "", kind: "", archived: "", sort: "name", order: "asc", page: "1" };
const SORTABLE = new Set(["name", "kind", "createdAt", "lastCapturedOn", "runCount"]);

interface VehiclePage {
  items: VehicleSummary[];
  total: number;
}

const helper = columnHelperFor<VehicleSummary>();

function fleetColumns(slug: string) {
  return helper.columns([
    helper.accessor("name", {
      header: "Name",
      cell: ({ row }) => (
        <span className="flex flex-wrap items-center gap-2">
          <Link href={`/w/${slug}/vehicles/${row.original.id}`} className="link">
            {row.original.name}
          </Link>
          {row.original.archived ? (
            <span className="rounded-full border border-chart-rule px-2 text-xs text-chart-muted">archived</span>
          ) : null}
        </span>
      ),
    }),
    helper.accessor("kind", { header: "Kind", cell: ({ getValue }) => VEHICLE_KIND_LABELS[getValue()] }),
    helper.accessor("serialTag", {
      header: "Serial / tag",
      enableSorting: false,
      meta: { cellClassName: "font-mono text-xs" },
      cell: ({ getValue }) => getValue() || <span className="text-chart-muted">—</span>,
    }),
    helper.accessor("customer", {
      header: "Customer",
      enableSorting: false,
      cell: ({ getValue }) => getValue() || <span className="text-chart-muted">—</span>,
    }),
    helper.accessor("sensorCount", { header: "Sensors", enableSorting: false, meta: { align: "end" } }),
    helper.accessor("runCount", { header: "Runs", sortDescFirst: true, meta: { align: "end" } }),
    helper.accessor("lastCapturedOn", {
      header: "Last capture",
      sortDescFirst: true,
      meta: { cellClassName: "whitespace-nowrap font-mono text-xs" },
      cell: ({ getValue }) => getValue() ?? <span className="text-chart-muted">never</span>,
    }),
    helper.accessor("lastVerdict", {
      header: "Last verdict",
      enableSorting: false,
      cell: ({ getValue }) => <VerdictBadge verdict={getValue()} />,
    }),
  ]);
}

/** The workspace's vehicles: filters and page in the address bar, sorted and paged by the server. */
export function FleetTable({ slug, canEdit }: { slug: string; canEdit: boolean }) {
  const [state, update] = useSearchState(DEFAULTS);
  const page = pageFrom(state.page);
  const sort = SORTABLE.has(state.sort) ? state.sort : "name";
  const order = state.order === "desc" ? "desc" : "asc";
  const kind = (VEHICLE_KINDS as readonly string[]).includes(state.kind) ? (state.kind as VehicleKind) : "";
  const includeArchived = state.archived === "1";
  const request = { search: state.q, kind, archived: includeArchived ? "include" : undefined, sort, order, page, pageSize: PAGE_SIZE };
  const query = useQuery({
    queryKey: ["vehicles", slug, request],
    queryFn: () => apiFetch<VehiclePage>(withQuery(`/api/workspaces/${slug}/vehicles`, request)),
    placeholderData: keepPreviousData,
  });
  const columns = useMemo(() => fleetColumns(slug), [slug]);
  const filtered = Boolean(state.q || kind || includeArchived);
  // Remounting the search box is how clearing the filters also clears its typed text.
  const [searchKey, setSearchKey] = useState(0);
  const clearFilters = () => {
    update({ q: "", kind: "", archived: "" });
    setSearchKey((k) => k + 1);
  };

  return (
    <section className="card overflow-hidden" aria-labelledby="fleet-heading">
      <div className="flex flex-wrap items-end gap-4 px-4 pb-4 pt-5 sm:px-6">
        <h2 id="fleet-heading" className="mr-auto text-lg font-semibold">
          Vehicles
          {query.data ? (
            <span className="ml-2 font-mono text-sm font-normal text-chart-muted" data-testid="fleet-total">
              {query.data.total}
            </span>
          ) : null}
        </h2>
        <div className="w-full sm:w-64">
          <SearchInput
            key={searchKey}
            id="fleet-search"
            label="Search"
            value={state.q}
            placeholder="Name, serial, customer, airframe"
            onSearch={(q) => update({ q })}
          />
        </div>
        <div className="space-y-1.5">
          <label htmlFor="fleet-kind" className="block text-sm font-medium">
            Kind
          </label>
          <select id="fleet-kind" className="field-input" value={kind} onChange={(e) => update({ kind: e.target.value })}>
            <option value="">Every kind</option>
            {VEHICLE_KINDS.map((k) => (
              <option key={k} value={k}>
                {VEHICLE_KIND_LABELS[k]}
              </option>
            ))}
          </select>
        </div>
        <label className="flex items-center gap-2 pb-2 text-sm">
          <input
            type="checkbox"
            checked={includeArchived}
            onChange={(e) => update({ archived: e.target.checked ? "1" : "" })}
            className="h-4 w-4 accent-lox-600"
          />
          Show archived
        </label>
      </div>
      <DataTable
        label="Vehicles"
        columns={columns}
        rows={query.data?.items}
        total={query.data?.total ?? 0}
        getRowId={(v) => v.id}
        sort={{ id: sort, desc: order === "desc" }}
        onSortChange={(s) => update({ sort: s.id, order: s.desc ? "desc" : "asc" })}
        page={page}
        pageSize={PAGE_SIZE}
        onPageChange={(p) => update({ page: String(p) })}
        refreshing={query.isPlaceholderData}
        error={query.error ? query.error.message : null}
        rowTestId="vehicle-row"
        empty={
          filtered ? (
            <EmptyState
              title="No vehicle matches these filters"
              action={
                <button type="button" className="btn-quiet" onClick={clearFilters}>
                  Clear the filters
                </button>
              }
            >
              Try fewer words, another kind, or include archived vehicles.
            </EmptyState>
          ) : (
            <EmptyState title="No vehicles yet">
              {canEdit
                ? "Add the first one with “Add a vehicle”: its name and kind are enough. Then give it its sensors and upload a calibration run."
                : "An owner, a technician or a builder adds vehicles here. Ask one of them to register your fleet."}
            </EmptyState>
          )
        }
      />
    </section>
  );
}
