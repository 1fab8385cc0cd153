"use client";

import { FieldShell, TextField } from "@/components/ui/field";
import { fieldProblem, PendingButton, ProblemMessage, useApiForm } from "@/components/ui/api-form";
import { apiFetch } from "@/lib/api-client";
import type { SiteSummary } from "@/lib/data/sites";

/** Empty number fields would reach the server as zero, a real place; refuse them here instead. */
function requireNumbers(values: Record<string, string>) {
  const missing: Record<string, string> = {};
  if (!values.latitudeDeg?.trim()) missing.latitudeDeg = "Give the latitude in degrees, north positive.";
  if (!values.longitudeDeg?.trim()) missing.longitudeDeg = "Give the longitude in degrees, east positive.";
  if (Object.keys(missing).length) throw fieldProblem(missing);
}

/** Add a site, or edit one when `site` is given. */
export function SiteForm({
  slug,
  site,
  onSaved,
  onCancel,
}: {
  slug: string;
  site?: SiteSummary;
  onSaved: (site: SiteSummary) => void;
  onCancel: () => void;
}) {
  const editing = site !== undefined;
  const { onSubmit, pending, problem, fieldError } = useApiForm(async (values) => {
    requireNumbers(values);
    const body = {
      name: values.name,
      latitudeDeg: values.latitudeDeg.trim(),
      longitudeDeg: values.longitudeDeg.trim(),
      altitudeM: values.altitudeM?.trim() || 0,
      notes: values.notes ?? "",
    };
    const url = editing ? `/api/workspaces/${slug}/sites/${site.id}` : `/api/workspaces/${slug}/sites`;
    return (await apiFetch<{ site: SiteSummary }>(url, { method: editing ? "PATCH" : "POST", json: body })).site;
  }, onSaved);
  const prefix = editing ? `site-${site.id.slice(0, 8)}` : "site-new";
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={editing ? `Edit ${site.name}` : "Add a site"}>
      <ProblemMessage problem={problem} />
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
        <TextField id={`${prefix}-name`} name="name" label="Name" defaultValue={site?.name} maxLength={120} error={fieldError("name")} />
        <TextField
          id={`${prefix}-lat`}
          name="latitudeDeg"
          label="Latitude (°)"
          type="number"
          step="any"
          min={-90}
          max={90}
          defaultValue={site?.latitudeDeg}
          hint="WGS 84, north positive"
          error={fieldError("latitudeDeg")}
        />
        <TextField
          id={`${prefix}-lon`}
          name="longitudeDeg"
          label="Longitude (°)"
          type="number"
          step="any"
          min={-180}
          max={180}
          defaultValue={site?.longitudeDeg}
          hint="WGS 84, east positive"
          error={fieldError("longitudeDeg")}
        />
        <TextField
          id={`${prefix}-alt`}
          name="altitudeM"
          label="Altitude (m)"
          type="number"
          step="any"
          defaultValue={site?.altitudeM ?? 0}
          hint="Above the WGS 84 ellipsoid"
          error={fieldError("altitudeM")}
        />
      </div>
      <FieldShell
        id={`${prefix}-notes`}
        label="Notes"
        error={fieldError("notes")}
        hint="What is nearby: steel sheds, parked cars, rebar under the pad."
      >
        <textarea
          id={`${prefix}-notes`}
          name="notes"
          rows={2}
          className="field-input"
          defaultValue={site?.notes}
          maxLength={2000}
          aria-invalid={fieldError("notes") ? true : undefined}
        />
      </FieldShell>
      <div className="flex flex-wrap gap-2">
        <PendingButton pending={pending}>{editing ? "Save the site" : "Add the site"}</PendingButton>
        <button type="button" className="btn-quiet" onClick={onCancel}>
          Cancel
        </button>
      </div>
    </form>
  );
}
