"use client";

import type { ReactNode } from "react";
import { SearchInput } from "@/components/ui/search-input";
import { VERDICT_WORDS } from "@/components/ui/verdict-badge";
import { VERDICTS } from "@/lib/fleet-terms";

export interface RunFilterValues {
  q: string;
  vehicle: string;
  sensor: string;
  verdict: string;
  uploader: string;
  from: string;
  to: string;
}

export interface Choice {
  value: string;
  label: string;
}

function Filter({ id, label, children }: { id: string; label: string; children: ReactNode }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      {children}
    </div>
  );
}

function Choices({
  id,
  value,
  onChange,
  anyLabel,
  choices,
  disabled,
}: {
  id: string;
  value: string;
  onChange: (value: string) => void;
  anyLabel: string;
  choices: Choice[];
  disabled?: boolean;
}) {
  return (
    <select id={id} className="field-input" value={value} disabled={disabled} onChange={(event) => onChange(event.target.value)}>
      <option value="">{anyLabel}</option>
      {choices.map((c) => (
        <option key={c.value} value={c.value}>
          {c.label}
        </option>
      ))}
    </select>
  );
}

/**
 * The runs table's filters. A choice list that is null is left out: students do not see the
 * fleet, and only roles that may list people can filter by uploader.
 */
export function RunFilters({
  values,
  onChange,
  vehicles,
  sensors,
  uploaders,
  searchKey,
}: {
  values: RunFilterValues;
  onChange: (patch: Partial<RunFilterValues>) => void;
  vehicles: Choice[] | null;
  /** The chosen vehicle's sensors; null when no vehicle is chosen. */
  sensors: Choice[] | null;
  uploaders: Choice[] | null;
  searchKey: number;
}) {
  return (
    <div className="grid gap-3 px-4 pb-4 sm:grid-cols-2 sm:px-6 lg:grid-cols-4 xl:grid-cols-8">
      <div className="sm:col-span-2 lg:col-span-1 xl:col-span-2">
        <SearchInput
          key={searchKey}
          id="runs-search"
          label="Search"
          value={values.q}
          placeholder="Title, file or vehicle"
          onSearch={(q) => onChange({ q })}
        />
      </div>
      {vehicles ? (
        <Filter id="runs-vehicle" label="Vehicle">
          <Choices
            id="runs-vehicle"
            value={values.vehicle}
            anyLabel="Every vehicle"
            choices={vehicles}
            onChange={(vehicle) => onChange({ vehicle, sensor: "" })}
          />
        </Filter>
      ) : null}
      {vehicles || sensors ? (
        <Filter id="runs-sensor" label="Sensor">
          <Choices
            id="runs-sensor"
            value={values.sensor}
            anyLabel={sensors ? "Every sensor" : "Choose a vehicle first"}
            choices={sensors ?? []}
            disabled={!sensors}
            onChange={(sensor) => onChange({ sensor })}
          />
        </Filter>
      ) : null}
      <Filter id="runs-verdict" label="Verdict">
        <Choices
          id="runs-verdict"
          value={values.verdict}
          anyLabel="Any verdict"
          choices={VERDICTS.map((v) => ({ value: v, label: VERDICT_WORDS[v] }))}
          onChange={(verdict) => onChange({ verdict })}
        />
      </Filter>
      {uploaders ? (
        <Filter id="runs-uploader" label="Uploaded by">
          <Choices
            id="runs-uploader"
            value={values.uploader}
            anyLabel="Anyone"
            choices={uploaders}
            onChange={(uploader) => onChange({ uploader })}
          />
        </Filter>
      ) : null}
      <Filter id="runs-from" label="Captured from">
        <input
          id="runs-from"
          type="date"
          className="field-input"
          value={values.from}
          max={values.to || undefined}
          onChange={(event) => onChange({ from: event.target.value })}
        />
      </Filter>
      <Filter id="runs-to" label="Captured to">
        <input
          id="runs-to"
          type="date"
          className="field-input"
          value={values.to}
          min={values.from || undefined}
          onChange={(event) => onChange({ to: event.target.value })}
        />
      </Filter>
    </div>
  );
}
