"use client";

import type { GlitchBurstSpec } from "@/geometry/magnetometer-types";
import { GLITCH_KIND_LABELS } from "./scenario-draft";
import { fieldId, FaultSection, NumberBox } from "./scenario-fields";
import type { SectionProps } from "./scenario-sections";

const KINDS = Object.keys(GLITCH_KIND_LABELS) as GlitchBurstSpec["kind"][];

/** A glitch burst on the first compass: a stretch of readings far off the sphere. */
export function GlitchBurstSection({ draft, update, errors }: SectionProps) {
  const burst = draft.glitchBurst;
  const kindError = errors["spec.glitchBurst.kind"];
  const kindId = fieldId("spec.glitchBurst.kind");
  return (
    <FaultSection
      id="fault-glitch"
      title="A burst of bad compass readings"
      on={burst.on}
      onToggle={(on) => update((d) => void (d.glitchBurst.on = on))}
      summary="For a moment the first compass reads far from the Earth's field; the fit should leave that stretch out and say so."
    >
      <fieldset className="space-y-2" aria-describedby={kindError ? `${kindId}-error` : undefined}>
        <legend className="text-sm font-medium">What happens</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {KINDS.map((kind) => (
            <label
              key={kind}
              className="flex cursor-pointer gap-2 rounded-lg border border-chart-rule p-3 text-sm has-[:checked]:border-lox-500 has-[:checked]:bg-lox-50 has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-brass-400 dark:has-[:checked]:bg-lox-950"
            >
              <input
                type="radio"
                name="glitchBurst.kind"
                value={kind}
                className="mt-0.5 accent-lox-600"
                checked={burst.kind === kind}
                onChange={() => update((d) => void (d.glitchBurst.kind = kind))}
              />
              <span>
                <span className="block font-semibold">{GLITCH_KIND_LABELS[kind].label}</span>
                <span className="block text-xs text-chart-muted">{GLITCH_KIND_LABELS[kind].hint}</span>
              </span>
            </label>
          ))}
        </div>
        {kindError ? (
          <p id={`${kindId}-error`} role="alert" className="text-xs font-medium text-halt dark:text-red-300">
            {kindError}
          </p>
        ) : null}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberBox
          name="spec.glitchBurst.startS"
          label="Starts after"
          unit="s"
          value={burst.startS}
          onChange={(v) => update((d) => void (d.glitchBurst.startS = v))}
          error={errors["spec.glitchBurst.startS"]}
          hint="From the start of the capture, holds included."
        />
        <NumberBox
          name="spec.glitchBurst.durationS"
          label="Lasts"
          unit="s"
          value={burst.durationS}
          onChange={(v) => update((d) => void (d.glitchBurst.durationS = v))}
          error={errors["spec.glitchBurst.durationS"]}
        />
        <NumberBox
          name="spec.glitchBurst.fieldMultiple"
          label={burst.kind === "stuck" ? "Size of the stuck reading" : "Size of the added field"}
          unit="× the field"
          value={burst.fieldMultiple}
          onChange={(v) => update((d) => void (d.glitchBurst.fieldMultiple = v))}
          error={errors["spec.glitchBurst.fieldMultiple"]}
          hint="In multiples of the Earth's field at the site."
        />
      </div>
    </FaultSection>
  );
}
