"use client";

import { FieldShell, SelectField, TextField } from "@/components/ui/field";
import { PendingButton, ProblemMessage, useApiForm } from "@/components/ui/api-form";
import { apiFetch } from "@/lib/api-client";
import type { VehicleSummary } from "@/lib/data/vehicles";
import { VEHICLE_KINDS, VEHICLE_KIND_LABELS } from "@/lib/fleet-terms";

const KIND_OPTIONS = VEHICLE_KINDS.map((k) => ({ value: k, label: VEHICLE_KIND_LABELS[k] }));

/**
 * Add a vehicle, or edit one when `vehicle` is given. Every message the server sends for a
 * field appears under that field.
 */
export function VehicleForm({
  slug,
  vehicle,
  onSaved,
  onCancel,
}: {
  slug: string;
  vehicle?: VehicleSummary;
  onSaved: (vehicle: VehicleSummary, form: HTMLFormElement) => void;
  onCancel?: () => void;
}) {
  const editing = vehicle !== undefined;
  const { onSubmit, pending, problem, fieldError } = useApiForm(async (values) => {
    const body = {
      name: values.name,
      kind: values.kind,
      airframe: values.airframe,
      serialTag: values.serialTag,
      customer: values.customer,
      notes: values.notes,
    };
    const url = editing ? `/api/workspaces/${slug}/vehicles/${vehicle.id}` : `/api/workspaces/${slug}/vehicles`;
    const answer = await apiFetch<{ vehicle: VehicleSummary }>(url, {
      method: editing ? "PATCH" : "POST",
      json: editing ? { ...body, archived: vehicle.archived } : body,
    });
    return answer.vehicle;
  }, onSaved);
  const prefix = editing ? "vehicle-edit" : "vehicle-new";
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" aria-label={editing ? "Edit the vehicle" : "Add a vehicle"}>
      <ProblemMessage problem={problem} />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField
          id={`${prefix}-name`}
          name="name"
          label="Name"
          defaultValue={vehicle?.name}
          error={fieldError("name")}
          hint="What your team calls it, e.g. “Survey hex 2”."
          maxLength={120}
        />
        <SelectField
          id={`${prefix}-kind`}
          name="kind"
          label="Kind"
          defaultValue={vehicle?.kind ?? "multirotor"}
          options={KIND_OPTIONS}
          error={fieldError("kind")}
        />
        <TextField
          id={`${prefix}-airframe`}
          name="airframe"
          label="Airframe"
          defaultValue={vehicle?.airframe}
          error={fieldError("airframe")}
          hint="Frame or model, optional."
          maxLength={200}
        />
        <TextField
          id={`${prefix}-serial`}
          name="serialTag"
          label="Serial or tag"
          defaultValue={vehicle?.serialTag}
          error={fieldError("serialTag")}
          maxLength={80}
        />
        <TextField
          id={`${prefix}-customer`}
          name="customer"
          label="Owner or customer"
          defaultValue={vehicle?.customer}
          error={fieldError("customer")}
          maxLength={120}
        />
      </div>
      <FieldShell id={`${prefix}-notes`} label="Notes" error={fieldError("notes")}>
        <textarea
          id={`${prefix}-notes`}
          name="notes"
          rows={3}
          className="field-input"
          defaultValue={vehicle?.notes}
          maxLength={4000}
          aria-invalid={fieldError("notes") ? true : undefined}
          aria-describedby={fieldError("notes") ? `${prefix}-notes-error` : undefined}
        />
      </FieldShell>
      <div className="flex flex-wrap gap-2">
        <PendingButton pending={pending}>{editing ? "Save changes" : "Add the vehicle"}</PendingButton>
        {onCancel ? (
          <button type="button" className="btn-quiet" onClick={onCancel}>
            Cancel
          </button>
        ) : null}
      </div>
    </form>
  );
}
