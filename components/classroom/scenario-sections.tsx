"use client";

import { SOFT_IRON_LEVELS } from "@/geometry/simulator";
import type { ScenarioSpec } from "@/geometry/scenario";
import { fieldId, FormGroup, NumberBox, TripleBox } from "./scenario-fields";
import { PATH_LABELS, setSoftIronEntry, SOFT_IRON_LABELS, type ScenarioDraft, type SoftIronChoice, type Triple } from "./scenario-draft";
import { expectedField } from "./scenario-preview-compute";
import { SCENARIO_LIMITS } from "./scenario-draft-read";

export interface SectionProps {
  draft: ScenarioDraft;
  update: (change: (draft: ScenarioDraft) => void) => void;
  errors: Record<string, string>;
}

const identity: [Triple, Triple, Triple] = [
  ["1", "0", "0"],
  ["0", "1", "0"],
  ["0", "0", "1"],
];

function presetMatrix(choice: SoftIronChoice, custom: [Triple, Triple, Triple]): [Triple, Triple, Triple] {
  if (choice === "custom") return custom;
  return SOFT_IRON_LEVELS[choice].map((row) => row.map(String)) as [Triple, Triple, Triple];
}

const round1 = (value: number) => value.toFixed(1).replace("-", "−");

/** The site, the date, and what the World Magnetic Model expects there and then. */
export function SiteSection({ draft, update, errors }: SectionProps) {
  const latitudeDeg = Number(draft.site.latitudeDeg);
  const longitudeDeg = Number(draft.site.longitudeDeg);
  const altitudeM = Number(draft.site.altitudeM);
  const usable =
    !errors["spec.site.latitudeDeg"] && !errors["spec.site.longitudeDeg"] && !errors["spec.site.altitudeM"] && !errors["spec.date"];
  const field = usable ? expectedField({ latitudeDeg, longitudeDeg, altitudeM }, draft.date) : null;
  return (
    <FormGroup title="Site and date">
      <NumberBox
        name="spec.site.name"
        label="Site name"
        numeric={false}
        value={draft.site.name}
        onChange={(v) => update((d) => void (d.site.name = v))}
        error={errors["spec.site.name"]}
      />
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberBox
          name="spec.site.latitudeDeg"
          label="Latitude"
          unit="°"
          value={draft.site.latitudeDeg}
          onChange={(v) => update((d) => void (d.site.latitudeDeg = v))}
          error={errors["spec.site.latitudeDeg"]}
          hint="North positive"
        />
        <NumberBox
          name="spec.site.longitudeDeg"
          label="Longitude"
          unit="°"
          value={draft.site.longitudeDeg}
          onChange={(v) => update((d) => void (d.site.longitudeDeg = v))}
          error={errors["spec.site.longitudeDeg"]}
          hint="East positive"
        />
        <NumberBox
          name="spec.site.altitudeM"
          label="Altitude"
          unit="m"
          value={draft.site.altitudeM}
          onChange={(v) => update((d) => void (d.site.altitudeM = v))}
          error={errors["spec.site.altitudeM"]}
          hint="WGS 84"
        />
      </div>
      <div className="space-y-1">
        <label htmlFor={fieldId("spec.date")} className="block text-sm font-medium">
          Date of the capture
        </label>
        <input
          id={fieldId("spec.date")}
          type="date"
          className="field-input w-auto"
          value={draft.date}
          onChange={(event) => update((d) => void (d.date = event.target.value))}
          aria-invalid={errors["spec.date"] ? true : undefined}
          aria-describedby={errors["spec.date"] ? `${fieldId("spec.date")}-error` : undefined}
        />
        {errors["spec.date"] ? (
          <p id={`${fieldId("spec.date")}-error`} role="alert" className="text-xs font-medium text-halt dark:text-red-300">
            {errors["spec.date"]}
          </p>
        ) : null}
      </div>
      <p className="rounded-lg bg-chart-paper px-3 py-2 text-sm" aria-live="polite" data-testid="expected-field">
        {field ? (
          <>
            The World Magnetic Model ({field.modelName}) expects{" "}
            <strong className="font-mono tabular-nums">{round1(field.fieldStrengthMicrotesla)} µT</strong> here, inclination{" "}
            <strong className="font-mono tabular-nums">{round1(field.inclinationDeg)}°</strong>, declination{" "}
            <span className="font-mono tabular-nums">{round1(field.declinationDeg)}°</span>.
            {field.withinValidity ? null : " The date lies outside the model's validity, so these values are only indicative."}
          </>
        ) : (
          "Give a valid position and date to see the field the World Magnetic Model expects there."
        )}
      </p>
    </FormGroup>
  );
}

/** The first compass: noise, hard iron and soft iron. */
export function CompassSection({ draft, update, errors }: SectionProps) {
  const matrix = presetMatrix(draft.softIron, draft.softIronMatrix);
  const custom = draft.softIron === "custom";
  const softIronError = errors["spec.softIron"];
  return (
    <FormGroup title="The compass">
      <NumberBox
        name="spec.noiseMicrotesla"
        label="Noise (standard deviation)"
        unit="µT"
        value={draft.noiseMicrotesla}
        onChange={(v) => update((d) => void (d.noiseMicrotesla = v))}
        error={errors["spec.noiseMicrotesla"]}
        hint="A few tenths of a µT is a good sensor; several µT is a poor one or a noisy bus."
      />
      <TripleBox
        name="spec.hardIronOffset"
        legend="Hard-iron offset"
        unit="µT"
        value={draft.hardIronOffset}
        onChange={(v) => update((d) => void (d.hardIronOffset = v))}
        errors={errors}
        hint="A constant field from magnetised parts: the cloud of readings is shifted by it."
      />
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">Soft iron</legend>
        <div className="inline-flex overflow-hidden rounded-lg border border-chart-rule text-sm">
          {(Object.keys(SOFT_IRON_LABELS) as SoftIronChoice[]).map((choice) => (
            <label
              key={choice}
              className="cursor-pointer px-3 py-1.5 has-[:checked]:bg-lox-600 has-[:checked]:text-white has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-inset has-[:focus-visible]:ring-brass-400 dark:has-[:checked]:bg-lox-400 dark:has-[:checked]:text-lox-950"
            >
              <input
                type="radio"
                name="softIron"
                value={choice}
                className="sr-only"
                checked={draft.softIron === choice}
                onChange={() =>
                  update((d) => {
                    // Custom starts from what was shown, so a small change to "mild" is one edit away.
                    if (choice === "custom" && d.softIron !== "custom")
                      d.softIronMatrix = d.softIron === "none" ? identity : presetMatrix(d.softIron, d.softIronMatrix);
                    d.softIron = choice;
                  })
                }
              />
              {SOFT_IRON_LABELS[choice]}
            </label>
          ))}
        </div>
        <div
          className="grid w-fit grid-cols-3 gap-1.5"
          role="group"
          aria-label="Soft-iron matrix, row by row"
          data-testid="soft-iron-matrix"
        >
          {[0, 1, 2].map((row) =>
            [0, 1, 2].map((col) => {
              const upper = col >= row;
              const key = `spec.softIron.${Math.min(row, col)}.${Math.max(row, col)}`;
              const id = fieldId(`spec.softIron.${row}.${col}`);
              return (
                <span key={`${row}${col}`}>
                  <label htmlFor={id} className="sr-only">
                    Soft iron, row {row + 1}, column {col + 1}
                    {upper ? "" : " (mirrors the entry across the diagonal)"}
                  </label>
                  <input
                    id={id}
                    type="text"
                    inputMode="decimal"
                    className={`field-input w-20 text-center font-mono tabular-nums ${custom && upper ? "" : "bg-chart-paper text-chart-muted"}`}
                    value={matrix[row][col]}
                    readOnly={!custom || !upper}
                    tabIndex={custom && upper ? undefined : -1}
                    onChange={(event) =>
                      update((d) => void (d.softIronMatrix = setSoftIronEntry(d.softIronMatrix, row, col, event.target.value)))
                    }
                    aria-invalid={custom && upper && errors[key] ? true : undefined}
                  />
                </span>
              );
            }),
          )}
        </div>
        <p className="text-xs text-chart-muted">
          {custom
            ? `Type the upper triangle; the lower one mirrors it. Diagonal ${SCENARIO_LIMITS.softIronDiagonal.min}–${SCENARIO_LIMITS.softIronDiagonal.max}, cross terms within ±${SCENARIO_LIMITS.softIronOffDiagonal.max}.`
            : "Ferrous metal near the compass squashes the sphere of readings into an ellipsoid by this matrix."}
        </p>
        {custom
          ? [0, 1, 2].flatMap((row) =>
              [row, row + 1, row + 2]
                .filter((col) => col <= 2)
                .map((col) => {
                  const key = `spec.softIron.${row}.${col}`;
                  return errors[key] ? (
                    <p key={key} role="alert" className="text-xs font-medium text-halt dark:text-red-300">
                      Row {row + 1}, column {col + 1}: {errors[key]}
                    </p>
                  ) : null;
                }),
            )
          : null}
        {softIronError ? (
          <p role="alert" className="text-xs font-medium text-halt dark:text-red-300">
            {softIronError}
          </p>
        ) : null}
      </fieldset>
    </FormGroup>
  );
}

/** How the vehicle is turned, for how long, how often it is sampled, and the seed of the noise. */
export function PathSection({ draft, update, errors }: SectionProps) {
  return (
    <FormGroup title="Rotation">
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">Rotation path</legend>
        <div className="grid gap-2 sm:grid-cols-2">
          {(Object.keys(PATH_LABELS) as ScenarioSpec["path"][]).map((path) => (
            <label
              key={path}
              className="flex cursor-pointer gap-2 rounded-lg border border-chart-rule p-3 text-sm has-[:checked]:border-lox-500 has-[:checked]:bg-lox-50 has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-brass-400 dark:has-[:checked]:bg-lox-950"
            >
              <input
                type="radio"
                name="path"
                value={path}
                className="mt-0.5 accent-lox-600"
                checked={draft.path === path}
                onChange={() => update((d) => void (d.path = path))}
              />
              <span>
                <span className="block font-semibold">{PATH_LABELS[path].label}</span>
                <span className="block text-xs text-chart-muted">{PATH_LABELS[path].hint}</span>
              </span>
            </label>
          ))}
        </div>
        {errors["spec.path"] ? (
          <p role="alert" className="text-xs font-medium text-halt dark:text-red-300">
            {errors["spec.path"]}
          </p>
        ) : null}
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberBox
          name="spec.pathSeconds"
          label="Length of the rotation"
          unit="s"
          value={draft.pathSeconds}
          onChange={(v) => update((d) => void (d.pathSeconds = v))}
          error={errors["spec.pathSeconds"]}
        />
        <NumberBox
          name="spec.sampleRateHz"
          label="Sample rate"
          unit="Hz"
          value={draft.sampleRateHz}
          onChange={(v) => update((d) => void (d.sampleRateHz = v))}
          error={errors["spec.sampleRateHz"]}
        />
        <div className="space-y-1">
          <NumberBox
            name="spec.seed"
            label="Seed"
            value={draft.seed}
            onChange={(v) => update((d) => void (d.seed = v))}
            error={errors["spec.seed"]}
            hint="Same seed, same samples."
          />
          <button
            type="button"
            className="text-xs font-semibold text-lox-600 hover:underline dark:text-lox-300"
            onClick={() => update((d) => void (d.seed = String(1 + Math.floor(Math.random() * 999_999))))}
          >
            Draw another seed
          </button>
        </div>
      </div>
    </FormGroup>
  );
}
