"use client";

import { FieldShell } from "@/components/ui/field";
import { UNIT_LABEL, CANONICAL_UNIT } from "@/geometry/units";
import { UNIT_CHOICES, UNIT_QUANTITY_LABELS, unitChoiceLabel, type UnitQuantity } from "./capture-mapping";

const UNSTATED_HINT: Record<UnitQuantity, string> = {
  magnetic: "Not stated: the field strength will not be compared with the World Magnetic Model.",
  acceleration: "Not stated: guessed from the readings at rest (one gravity).",
  rate: "Not stated: guessed from the largest rates.",
  time: "Not stated: guessed from the step between samples.",
  current: "Not stated: read as amperes.",
};

/** Splits "counts:0.15" into the unit and its scale. */
function split(text: string): { unit: string; scale: string } {
  const [unit, scale = ""] = text.split(":");
  return { unit, scale };
}

/**
 * One unit select per quantity the mapped columns carry, prefilled from the column names.
 * Values are the API's unit texts ("uT", "deg/s", "counts:0.15"); "" leaves it unstated.
 */
export function UnitFields({
  quantities,
  values,
  hints,
  errors,
  onChange,
}: {
  quantities: UnitQuantity[];
  values: Partial<Record<UnitQuantity, string>>;
  hints: Partial<Record<UnitQuantity, string>>;
  errors: Record<string, string>;
  onChange: (quantity: UnitQuantity, value: string) => void;
}) {
  if (quantities.length === 0) return <p className="text-sm text-chart-muted">Map some columns first.</p>;
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      {quantities.map((quantity) => {
        const value = values[quantity] ?? "";
        const { unit, scale } = split(value);
        const id = `unit-${quantity}`;
        const error = errors[`units.${quantity}`];
        const fromName = hints[quantity] !== undefined && hints[quantity] === value;
        const hint = value === "" ? UNSTATED_HINT[quantity] : fromName ? "As the column names say." : undefined;
        return (
          <div key={quantity} className="space-y-2">
            <FieldShell id={id} label={`${UNIT_QUANTITY_LABELS[quantity]} unit`} error={error} hint={hint}>
              <select
                id={id}
                className="field-input"
                value={unit}
                aria-invalid={error ? true : undefined}
                aria-describedby={error ? `${id}-error` : hint ? `${id}-hint` : undefined}
                onChange={(event) =>
                  onChange(quantity, event.target.value === "counts" ? `counts${scale ? `:${scale}` : ""}` : event.target.value)
                }
              >
                <option value="">Not stated</option>
                {UNIT_CHOICES[quantity].map((choice) => (
                  <option key={choice} value={choice}>
                    {unitChoiceLabel(choice)}
                  </option>
                ))}
              </select>
            </FieldShell>
            {unit === "counts" ? (
              <FieldShell
                id={`${id}-scale`}
                label={`${UNIT_LABEL[CANONICAL_UNIT[quantity]]} per count`}
                hint="From the sensor’s data sheet. Without it the readings stay raw and checks against references are skipped."
              >
                <input
                  id={`${id}-scale`}
                  className="field-input"
                  inputMode="decimal"
                  value={scale}
                  aria-describedby={`${id}-scale-hint`}
                  onChange={(event) => onChange(quantity, event.target.value.trim() ? `counts:${event.target.value.trim()}` : "counts")}
                />
              </FieldShell>
            ) : null}
          </div>
        );
      })}
    </div>
  );
}
