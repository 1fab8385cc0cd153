"use client";

import type { ReactNode } from "react";
import type { Triple } from "./scenario-draft";

/** The id of the input for an API field name ("spec.site.latitudeDeg" → "field-spec-site-latitudeDeg"). */
export const fieldId = (key: string) => `field-${key.replaceAll(".", "-")}`;

function ErrorText({ id, error }: { id: string; error?: string }) {
  if (!error) return null;
  return (
    <p id={`${id}-error`} role="alert" className="text-xs font-medium text-halt dark:text-red-300">
      {error}
    </p>
  );
}

/** A number box with its unit beside it and its message beneath. */
export function NumberBox({
  name,
  label,
  value,
  onChange,
  error,
  unit,
  hint,
  numeric = true,
}: {
  name: string;
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string;
  unit?: string;
  hint?: ReactNode;
  /** False for words (a site name): no decimal keypad, no figures font. */
  numeric?: boolean;
}) {
  const id = fieldId(name);
  const describedBy = error ? `${id}-error` : hint ? `${id}-hint` : undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={id}
          name={name}
          type="text"
          inputMode={numeric ? "decimal" : undefined}
          className={numeric ? "field-input font-mono tabular-nums" : "field-input"}
          value={value}
          onChange={(event) => onChange(event.target.value)}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          autoComplete="off"
        />
        {unit ? <span className="shrink-0 text-sm text-chart-muted">{unit}</span> : null}
      </div>
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-chart-muted">
          {hint}
        </p>
      ) : null}
      <ErrorText id={id} error={error} />
    </div>
  );
}

const AXES = ["x", "y", "z"] as const;

/** Three boxes for a body-frame vector (x forward, y right, z down), each with its own message. */
export function TripleBox({
  name,
  legend,
  unit,
  value,
  onChange,
  errors,
  hint,
}: {
  name: string;
  legend: string;
  unit: string;
  value: Triple;
  onChange: (value: Triple) => void;
  errors: Record<string, string>;
  hint?: ReactNode;
}) {
  return (
    <fieldset className="space-y-1">
      <legend className="text-sm font-medium">
        {legend} <span className="font-normal text-chart-muted">({unit}, body axes)</span>
      </legend>
      <div className="grid grid-cols-3 gap-2">
        {AXES.map((axis, i) => {
          const key = `${name}.${i}`;
          const id = fieldId(key);
          return (
            <div key={axis} className="flex items-center gap-1.5">
              <label htmlFor={id} className="w-3 shrink-0 font-mono text-sm text-chart-muted">
                <span aria-hidden>{axis}</span>
                <span className="sr-only">
                  {legend} {axis} ({unit})
                </span>
              </label>
              <input
                id={id}
                name={key}
                type="text"
                inputMode="decimal"
                className="field-input font-mono tabular-nums"
                value={value[i]}
                onChange={(event) => {
                  const next = [...value] as Triple;
                  next[i] = event.target.value;
                  onChange(next);
                }}
                aria-invalid={errors[key] ? true : undefined}
                aria-describedby={errors[key] ? `${id}-error` : undefined}
                autoComplete="off"
              />
            </div>
          );
        })}
      </div>
      {hint ? <p className="text-xs text-chart-muted">{hint}</p> : null}
      {AXES.map((axis, i) => (
        <ErrorText
          key={axis}
          id={fieldId(`${name}.${i}`)}
          error={errors[`${name}.${i}`] ? `${axis}: ${errors[`${name}.${i}`]}` : undefined}
        />
      ))}
    </fieldset>
  );
}

/** A group of fields for one fault, switched on and off by the box in its heading. */
export function FaultSection({
  id,
  title,
  on,
  onToggle,
  summary,
  children,
}: {
  id: string;
  title: string;
  on: boolean;
  onToggle: (on: boolean) => void;
  /** What the fault does, in a sentence, shown whether it is on or off. */
  summary: ReactNode;
  children: ReactNode;
}) {
  return (
    <section
      className={`rounded-lg border p-4 ${on ? "border-lox-400/60 bg-chart-sheet" : "border-chart-rule"}`}
      aria-labelledby={`${id}-title`}
    >
      <label className="flex cursor-pointer items-start gap-3">
        <input
          type="checkbox"
          className="mt-1 h-4 w-4 accent-lox-600"
          checked={on}
          onChange={(event) => onToggle(event.target.checked)}
          aria-describedby={`${id}-summary`}
        />
        <span>
          <span id={`${id}-title`} className="block font-semibold">
            {title}
          </span>
          <span id={`${id}-summary`} className="block text-sm text-chart-muted">
            {summary}
          </span>
        </span>
      </label>
      {on ? <div className="mt-4 space-y-4">{children}</div> : null}
    </section>
  );
}

/** A titled group of always-present fields. */
export function FormGroup({ title, children, aside }: { title: string; children: ReactNode; aside?: ReactNode }) {
  return (
    <fieldset className="space-y-4 rounded-lg border border-chart-rule p-4">
      <legend className="px-1 font-display text-base font-semibold">{title}</legend>
      {children}
      {aside}
    </fieldset>
  );
}
