"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { SiteForm } from "@/components/sites/site-form";
import { EmptyState } from "@/components/ui/empty-state";
import type { SiteSummary } from "@/lib/data/sites";
import { TableHead } from "@/components/ui/table-head";

const degrees = (value: number) => value.toFixed(5);

/** The workspace's calibration sites; add and edit for roles that may. */
export function SiteList({ slug, sites, canEdit }: { slug: string; sites: SiteSummary[]; canEdit: boolean }) {
  const router = useRouter();
  // "new" while adding, a site id while editing it.
  const [open, setOpen] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const editing = sites.find((s) => s.id === open);
  const done = (site: SiteSummary) => {
    setSaved(`${site.name} saved.`);
    setOpen(null);
    router.refresh();
  };
  return (
    <section className="card overflow-hidden" aria-labelledby="sites-heading">
      <div className="flex flex-wrap items-center justify-between gap-3 px-6 pt-6">
        <h2 id="sites-heading" className="text-lg font-semibold">
          Sites
        </h2>
        {canEdit && open !== "new" ? (
          <button type="button" className="btn-primary" onClick={() => setOpen("new")}>
            Add a site
          </button>
        ) : null}
      </div>
      {saved ? (
        <p role="status" className="mx-6 mt-4 rounded-lg border border-steady/30 bg-steady-soft px-3 py-2 text-sm">
          {saved}
        </p>
      ) : null}
      {canEdit && open ? (
        <div className="border-b border-chart-rule p-6">
          <h3 className="mb-4 text-base font-semibold">{editing ? `Edit ${editing.name}` : "Add a site"}</h3>
          <SiteForm key={open} slug={slug} site={editing} onSaved={done} onCancel={() => setOpen(null)} />
        </div>
      ) : null}
      {sites.length === 0 ? (
        <EmptyState title="No sites yet">
          {canEdit
            ? "Add the places where you calibrate, with their coordinates, so each run can be checked against the field expected there."
            : "An owner, a technician or a builder adds the places where the team calibrates."}
        </EmptyState>
      ) : (
        <div className="mt-4 overflow-x-auto">
          <table className="w-full text-left text-sm" aria-label="Sites">
            <TableHead
              columns={[
                "Name",
                { label: "Latitude °", numeric: true },
                { label: "Longitude °", numeric: true },
                { label: "Altitude m", numeric: true },
                "Notes",
              ]}
              actions={canEdit}
            />
            <tbody className="divide-y divide-chart-rule">
              {sites.map((site) => (
                <tr key={site.id} data-testid="site-row">
                  <td className="px-6 py-2.5 font-medium">{site.name}</td>
                  <td className="px-4 py-2.5 text-right font-mono text-xs tabular-nums">{degrees(site.latitudeDeg)}</td>
                  <td className="px-4 py-2.5 text-right font-mono text-xs tabular-nums">{degrees(site.longitudeDeg)}</td>
                  <td className="px-4 py-2.5 text-right font-mono text-xs tabular-nums">{site.altitudeM.toFixed(0)}</td>
                  <td className="max-w-80 px-4 py-2.5 text-chart-muted">{site.notes || "—"}</td>
                  {canEdit ? (
                    <td className="px-6 py-2.5 text-right">
                      <button
                        type="button"
                        className="text-xs font-semibold text-lox-600 hover:underline dark:text-lox-300"
                        onClick={() => setOpen(site.id)}
                        aria-label={`Edit ${site.name}`}
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
      <div className="h-2" />
    </section>
  );
}
