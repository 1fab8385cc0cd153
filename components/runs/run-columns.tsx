"use client";

import Link from "next/link";
import { columnHelperFor } from "@/components/ui/data-table";
import { VerdictBadge } from "@/components/ui/verdict-badge";
import { RunStatus } from "@/components/runs/run-status";
import type { RunSummary } from "@/lib/data/runs";

const helper = columnHelperFor<RunSummary>();

/** The server's sort keys; a column whose id is not here cannot be sorted. */
export const RUN_SORT_KEYS = [
  "capturedOn",
  "createdAt",
  "verdict",
  "coverageFraction",
  "residualRms",
  "fieldStrength",
  "offsetNorm",
  "vehicle",
] as const;

const dash = <span className="text-chart-muted">—</span>;

/** A header with its unit beneath it, kept in its own case: an upper-case µ would read as M. */
function withUnit(label: string, unit: string) {
  return function UnitHeader() {
    return (
      <span className="text-right">
        {label}
        <span className="block normal-case tracking-normal">{unit}</span>
      </span>
    );
  };
}

/** A number with a fixed count of decimals, or a dash when the run has none. */
function figure(value: number | null, digits: number) {
  return value === null || !Number.isFinite(value) ? dash : value.toFixed(digits);
}

/** Columns of the runs table; `showVehicle` is off on a vehicle's own page. */
export function runColumns({ slug, showVehicle, linkVehicles }: { slug: string; showVehicle: boolean; linkVehicles: boolean }) {
  const columns = helper.columns([
    helper.accessor("capturedOn", {
      header: "Captured on",
      sortDescFirst: true,
      meta: { cellClassName: "whitespace-nowrap font-mono text-xs" },
    }),
    helper.accessor("vehicleName", {
      id: "vehicle",
      header: "Vehicle",
      cell: ({ row }) =>
        linkVehicles ? (
          <Link href={`/w/${slug}/vehicles/${row.original.vehicleId}`} className="hover:underline">
            {row.original.vehicleName}
          </Link>
        ) : (
          row.original.vehicleName
        ),
    }),
    helper.accessor("title", {
      header: "Run",
      enableSorting: false,
      cell: ({ row }) => {
        const run = row.original;
        return (
          <span className="block max-w-64">
            <Link href={`/w/${slug}/runs/${run.id}`} className="link break-words">
              {run.title || run.fileName}
            </Link>
            {run.title ? <span className="block truncate font-mono text-xs text-chart-muted">{run.fileName}</span> : null}
            <span className="flex flex-wrap gap-1">
              {run.signedOffAt ? <span className="text-xs text-steady dark:text-emerald-300">signed off</span> : null}
              {run.simulated ? <span className="text-xs text-chart-muted">simulated</span> : null}
              {run.powersMotors ? <span className="text-xs text-chart-muted">motors powered</span> : null}
            </span>
          </span>
        );
      },
    }),
    helper.accessor((run) => run.site?.name ?? null, {
      id: "site",
      header: "Site",
      enableSorting: false,
      cell: ({ getValue }) => getValue() ?? dash,
    }),
    helper.accessor("uploadedByName", { header: "Uploaded by", enableSorting: false, cell: ({ getValue }) => getValue() ?? dash }),
    helper.accessor("status", { header: "Status", enableSorting: false, cell: ({ row }) => <RunStatus run={row.original} /> }),
    helper.accessor("verdict", { header: "Verdict", cell: ({ getValue }) => <VerdictBadge verdict={getValue()} /> }),
    helper.accessor("coverageFraction", {
      header: withUnit("Coverage", "%"),
      sortDescFirst: true,
      meta: { align: "end" },
      cell: ({ getValue }) => {
        const value = getValue();
        return value === null ? dash : (value * 100).toFixed(0);
      },
    }),
    helper.accessor("residualRms", {
      header: withUnit("Residual", "µT"),
      meta: { align: "end" },
      cell: ({ getValue }) => figure(getValue(), 2),
    }),
    helper.accessor("fieldStrength", {
      header: withUnit("Field", "µT"),
      meta: { align: "end" },
      cell: ({ getValue }) => figure(getValue(), 1),
    }),
    helper.accessor("offsetNorm", {
      header: withUnit("Offset", "µT"),
      meta: { align: "end" },
      cell: ({ getValue }) => figure(getValue(), 1),
    }),
  ]);
  return showVehicle ? columns : columns.filter((c) => c.id !== "vehicle");
}
