"use client";

import { MOUNTING_ROTATIONS, mountingWords } from "@/geometry/mounting-rotations";
import { DEFAULT_MAGNETOMETER_RANGE_UT } from "@/geometry/magnetometer-range";
import { SafetyCautions } from "@/components/run/safety-cautions";
import { ALL_FACES, FACE_LABELS } from "./scenario-draft";
import { fieldId, FaultSection, NumberBox, TripleBox } from "./scenario-fields";
import { GlitchBurstSection } from "./scenario-burst-section";
import type { SectionProps } from "./scenario-sections";

const MOUNTING_OPTIONS = MOUNTING_ROTATIONS.map((r) => ({ id: r.id, words: r.words }));

function RotationSelect({
  name,
  label,
  value,
  onChange,
  error,
  hint,
}: {
  name: string;
  label: string;
  value: string;
  onChange: (v: string) => void;
  error?: string;
  hint: string;
}) {
  const id = fieldId(name);
  // A saved value that is none of the 48 mountings still shows, so its message makes sense.
  const options = MOUNTING_OPTIONS.some((o) => o.id === value) ? MOUNTING_OPTIONS : [{ id: value, words: value }, ...MOUNTING_OPTIONS];
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-medium">
        {label}
      </label>
      <select
        id={id}
        className="field-input"
        value={value}
        onChange={(event) => onChange(event.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : `${id}-hint`}
      >
        {options.map((o) => (
          <option key={o.id} value={o.id}>
            {o.words}
          </option>
        ))}
      </select>
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-xs font-medium text-halt dark:text-red-300">
          {error}
        </p>
      ) : (
        <p id={`${id}-hint`} className="text-xs text-chart-muted">
          {hint}
        </p>
      )}
    </div>
  );
}

/** The optional faults: a second compass, current in nearby wiring, saturation, shaky holds, steel nearby, a glitch burst. */
export function FaultSections({
  draft,
  update,
  errors,
  fieldStrengthMicrotesla,
}: SectionProps & { fieldStrengthMicrotesla: number | null }) {
  const second = draft.secondCompass;
  const against = second.mountingRotation !== second.declaredRotation;
  return (
    <div className="space-y-3">
      <FaultSection
        id="fault-second"
        title="A second compass"
        on={second.on}
        onToggle={(on) => update((d) => void (d.secondCompass.on = on))}
        summary="An external module beside the board's compass, mounted at one rotation and perhaps declared at another."
      >
        <div className="grid gap-3 sm:grid-cols-2">
          <RotationSelect
            name="spec.secondCompass.mountingRotation"
            label="Mounted at"
            value={second.mountingRotation}
            onChange={(v) => update((d) => void (d.secondCompass.mountingRotation = v))}
            error={errors["spec.secondCompass.mountingRotation"]}
            hint="How the module really sits on the vehicle."
          />
          <RotationSelect
            name="spec.secondCompass.declaredRotation"
            label="Declared as"
            value={second.declaredRotation}
            onChange={(v) => update((d) => void (d.secondCompass.declaredRotation = v))}
            error={errors["spec.secondCompass.declaredRotation"]}
            hint="What the flight controller is told."
          />
        </div>
        <p className={`text-sm ${against ? "font-medium" : "text-chart-muted"}`}>
          {against
            ? `Mounted ${mountingWords(second.mountingRotation)}, but declared ${mountingWords(second.declaredRotation)}: the module's readings disagree with the board's.`
            : "Mounted as declared: the two compasses agree once each is calibrated."}
        </p>
        <TripleBox
          name="spec.secondCompass.hardIronOffset"
          legend="Its hard-iron offset"
          unit="µT"
          value={second.hardIronOffset}
          onChange={(v) => update((d) => void (d.secondCompass.hardIronOffset = v))}
          errors={errors}
        />
      </FaultSection>

      <FaultSection
        id="fault-current"
        title="Current in the power wiring"
        on={draft.currentCoupling.on}
        onToggle={(on) => update((d) => void (d.currentCoupling.on = on))}
        summary="A motor run at the end of the capture: the wiring's field grows with the current and adds to the Earth's."
      >
        <TripleBox
          name="spec.currentCoupling.perAmpMicrotesla"
          legend="Field per ampere"
          unit="µT/A"
          value={draft.currentCoupling.perAmpMicrotesla}
          onChange={(v) => update((d) => void (d.currentCoupling.perAmpMicrotesla = v))}
          errors={errors}
        />
        <NumberBox
          name="spec.currentCoupling.maxAmps"
          label="Highest current of the motor run"
          unit="A"
          value={draft.currentCoupling.maxAmps}
          onChange={(v) => update((d) => void (d.currentCoupling.maxAmps = v))}
          error={errors["spec.currentCoupling.maxAmps"]}
        />
        <SafetyCautions />
      </FaultSection>

      <FaultSection
        id="fault-clip"
        title="Compass range and saturation"
        on={draft.clip.on}
        onToggle={(on) => update((d) => void (d.clip.on = on))}
        summary={`The compass's range: readings flatten at it, and the offset check judges how much of it the offset and the field leave free. Off, the common ±${DEFAULT_MAGNETOMETER_RANGE_UT} µT is assumed and nothing clips.`}
      >
        <NumberBox
          name="spec.clipLevelMicrotesla"
          label="Range, where readings clip (±, each axis)"
          unit="µT"
          value={draft.clip.levelMicrotesla}
          onChange={(v) => update((d) => void (d.clip.levelMicrotesla = v))}
          error={errors["spec.clipLevelMicrotesla"]}
          hint={
            fieldStrengthMicrotesla
              ? `The field here is about ${fieldStrengthMicrotesla.toFixed(0)} µT; a level below that plus the offset clips.`
              : "Below the field strength plus the offset, readings clip."
          }
        />
      </FaultSection>

      <FaultSection
        id="fault-holds"
        title="Accelerometer holds"
        on={draft.holds.on}
        onToggle={(on) => update((d) => void (d.holds.on = on))}
        summary="The vehicle is held still on its faces before the rotation; shaky hands spoil the holds."
      >
        <fieldset>
          <legend className="text-sm font-medium">Faces held, each pointing down in turn</legend>
          <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-3">
            {ALL_FACES.map((face) => (
              <label key={face} className="flex items-center gap-2 text-sm">
                <input
                  type="checkbox"
                  className="h-4 w-4 accent-lox-600"
                  checked={draft.holds.faces.includes(face)}
                  onChange={(event) =>
                    update((d) => {
                      d.holds.faces = event.target.checked
                        ? ALL_FACES.filter((f) => f === face || d.holds.faces.includes(f))
                        : d.holds.faces.filter((f) => f !== face);
                    })
                  }
                />
                {FACE_LABELS[face]} <span className="font-mono text-xs text-chart-muted">{face}</span>
              </label>
            ))}
          </div>
          {errors["spec.holds.faces"] ? (
            <p role="alert" className="mt-1 text-xs font-medium text-halt dark:text-red-300">
              {errors["spec.holds.faces"]}
            </p>
          ) : null}
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-2">
          <NumberBox
            name="spec.holds.wobbleDeg"
            label="Wobble during each hold"
            unit="°"
            value={draft.holds.wobbleDeg}
            onChange={(v) => update((d) => void (d.holds.wobbleDeg = v))}
            error={errors["spec.holds.wobbleDeg"]}
          />
          <NumberBox
            name="spec.holds.tiltDeg"
            label="Tilt away from each face"
            unit="°"
            value={draft.holds.tiltDeg}
            onChange={(v) => update((d) => void (d.holds.tiltDeg = v))}
            error={errors["spec.holds.tiltDeg"]}
          />
        </div>
      </FaultSection>

      <FaultSection
        id="fault-steel"
        title="Steel nearby"
        on={draft.steel.on}
        onToggle={(on) => update((d) => void (d.steel.on = on))}
        summary="A steel object beside the capture spot bends the local field away from the model's."
      >
        <NumberBox
          name="spec.steel.distanceM"
          label="Distance to the steel"
          unit="m"
          value={draft.steel.distanceM}
          onChange={(v) => update((d) => void (d.steel.distanceM = v))}
          error={errors["spec.steel.distanceM"]}
        />
      </FaultSection>

      <GlitchBurstSection draft={draft} update={update} errors={errors} />
    </div>
  );
}
