import { slotWords } from "@/geometry/sensor-slots";
import { rejectedStretchSentence } from "@/geometry/burst-words";
import { MountingPicture } from "@/components/fleet/mounting-picture";
import type { MagnetometerAnalysis } from "@/geometry/magnetometer-analysis";
import { eulerAnglesLine, mountingRotationById } from "@/geometry/mounting-rotations";
import { formatInterval, formatNumber, formatQuantity, formatSigned, percentFrom } from "./format";
import { modelWords, saturationFindings } from "./parameter-text";
import { AXES, Figure, MatrixTable, TABLE, TD, TH, TH_AXIS } from "./parameter-parts";

export interface ExpectedField {
  fieldStrengthMicrotesla: number;
  inclinationDeg: number;
  modelName: string;
}

/** A mounting id in words; "custom" and anything else that is none of the 48, said so. */
function mountingText(id: string | undefined): string {
  if (id === undefined || id === "custom") return "a custom rotation, none of the 48 axis-aligned mountings";
  return mountingRotationById(id)?.words ?? `“${id}” (none of the 48 mountings)`;
}

function Mounting({ compass }: { compass: MagnetometerAnalysis }) {
  const comparison = compass.mountingComparison;
  const closest = comparison ? comparison.result.nearest : null;
  return (
    <div className="space-y-2" data-testid="mounting">
      <h4 className="text-sm font-semibold">Mounting</h4>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4 print:grid-cols-4 print:gap-1">
        <Figure term="Declared mounting">{mountingText(compass.declaredRotation?.id)}</Figure>
        {comparison && closest ? (
          <>
            <Figure term="Measured rotation" testId="measured-rotation">
              against {slotWords(comparison.reference)}, closest mounting: <span className="font-semibold">{closest.words}</span>, residual{" "}
              <span className="font-mono">{formatQuantity(comparison.result.residualDeg, "°")}</span>
              {closest.eulerDeg ? <span className="block text-xs text-chart-muted">{eulerAnglesLine(closest)}</span> : null}
            </Figure>
            <Figure term="What the declarations imply">{mountingText(comparison.expectedId)}</Figure>
            <Figure term="Measured from declared" testId="rotation-from-declared">
              <span className="font-mono font-semibold">{formatQuantity(comparison.fromDeclaredDeg, "°")}</span>
            </Figure>
          </>
        ) : null}
      </dl>
      {comparison ? (
        <>
          <p className="text-sm text-chart-muted print:text-chart-ink">
            After the rotation, the two compasses’ field directions agree to {formatQuantity(comparison.result.rmsAngleDeg, "°")} RMS over{" "}
            {formatNumber(comparison.result.samplesUsed, 0)} samples.
            {comparison.result.determined
              ? ""
              : " The directions did not span enough of the sphere to fix all three angles; turn the vehicle further to be sure."}
          </p>
          <div className="flex flex-wrap items-start gap-4">
            <MatrixTable matrix={comparison.result.rotation} caption={`Measured rotation R (${comparison.reference} = R · this compass)`} />
            {closest?.id ? (
              <figure className="text-xs text-chart-muted">
                <MountingPicture mountingId={closest.id} />
                <figcaption>Closest mounting, against {comparison.reference}</figcaption>
              </figure>
            ) : null}
          </div>
        </>
      ) : null}
    </div>
  );
}

/**
 * One compass's parameters: the model and why, offsets and scales with 95% intervals, the
 * soft-iron matrix, field strength against the World Magnetic Model, residual, samples,
 * saturation and mounting; for a refused fit, the reason instead.
 */

/** Where the per-axis intervals come from, for the table's caption (older results have no method: a bootstrap). */
function intervalCaption(calibration: { bootstrapResamples: number; intervalMethod?: "bootstrap" | "sandwich" | "none" }): string {
  const method = calibration.intervalMethod ?? (calibration.bootstrapResamples > 0 ? "bootstrap" : "none");
  if (method === "sandwich") return "Per axis, with 95% intervals from the sandwich covariance (a long capture: many samples, one pass)";
  if (method === "none") return "Per axis (no intervals were computed)";
  return `Per axis, with 95% intervals from ${calibration.bootstrapResamples} bootstrap resamples`;
}

export function MagnetometerParameters({
  compass,
  name,
  expected,
  unit = "µT",
}: {
  compass: MagnetometerAnalysis;
  name: string;
  expected: ExpectedField | null;
  unit?: string;
}) {
  const calibration = compass.calibration;
  const headingId = `parameters-${compass.sensor}`;
  return (
    <section
      aria-labelledby={headingId}
      className="card break-inside-avoid space-y-4 p-5 print:rounded-none print:border-0 print:p-0 print:shadow-none"
      data-testid="magnetometer-parameters"
      data-sensor={compass.sensor}
    >
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-lg font-semibold">
          {name}
        </h3>
        <p className="text-sm">
          <span className="text-chart-muted">Model used: </span>
          <span className="font-medium">{calibration.ok ? modelWords(calibration.model) : "none — fit refused"}</span>
        </p>
      </div>

      {!calibration.ok ? (
        <div
          className="rounded-lg border border-halt/40 bg-halt-soft p-3 text-sm print:border-chart-ink print:bg-transparent"
          data-testid="fit-refused"
        >
          <p className="font-semibold">No calibration was fitted ({calibration.reason.replace(/-/g, " ")}).</p>
          <p className="mt-1">{calibration.detail}</p>
          {calibration.coverage ? (
            <p className="mt-1">
              The turns covered {formatQuantity(calibration.coverage.coveredFraction * 100, "%")} of the sphere; the largest gap is{" "}
              {formatQuantity(calibration.coverage.largestGapDeg, "°")} wide. {calibration.coverage.nextOrientation}
            </p>
          ) : null}
        </div>
      ) : (
        <>
          <div className="text-sm">
            {/* On paper the check list's "Calibration fit" already carries the reason. */}
            <p className="print:hidden">
              <span className="font-medium">Why this model: </span>
              {calibration.modelReason}
            </p>
            <table className={`${TABLE} mt-2 max-w-xl print:hidden`}>
              <caption className="sr-only">Models compared</caption>
              <thead>
                <tr>
                  <th scope="col" className={TH}>
                    Model
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    Parameters
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    Residual RMS
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    Score (lower wins)
                  </th>
                </tr>
              </thead>
              <tbody>
                {calibration.candidates.map((candidate) => (
                  <tr key={candidate.model} className={candidate.model === calibration.model ? "font-semibold" : ""}>
                    <td className="px-2 py-1 text-sm print:px-1 print:text-xs">
                      {modelWords(candidate.model)}
                      {candidate.model === calibration.model ? (
                        <span className="ml-2 text-xs text-lox-600 dark:text-lox-300">used</span>
                      ) : null}
                    </td>
                    <td className={`${TD} text-right`}>{candidate.parameterCount}</td>
                    <td className={`${TD} text-right`}>{formatQuantity(candidate.residualRms, unit, 2)}</td>
                    <td className={`${TD} text-right`}>{formatNumber(candidate.score, 0)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>

          <div className="grid gap-4 lg:grid-cols-[2fr_1fr] print:grid-cols-[auto_1fr]">
            <table className={TABLE} data-testid="per-axis">
              <caption className="mb-1 text-left text-sm font-medium">{intervalCaption(calibration)}</caption>
              <thead>
                <tr>
                  <th scope="col" className={TH}>
                    Axis
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    Hard-iron offset
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    95% interval
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    Scale
                  </th>
                  <th scope="col" className={`${TH} text-right`}>
                    95% interval
                  </th>
                </tr>
              </thead>
              <tbody>
                {AXES.map((axis, i) => (
                  <tr key={axis}>
                    <th scope="row" className={TH_AXIS}>
                      {axis}
                    </th>
                    <td className={`${TD} text-right`}>{formatQuantity(calibration.hardIronOffset[i], unit)}</td>
                    <td className={`${TD} text-right`}>{formatInterval(calibration.offsetInterval95[i], unit)}</td>
                    <td className={`${TD} text-right`}>{formatNumber(calibration.scales[i], 3)}</td>
                    <td className={`${TD} text-right`}>{formatInterval(calibration.scaleInterval95[i], null, 3)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <MatrixTable matrix={calibration.softIronMatrix} caption="Soft-iron matrix W (corrected = W · (raw − offset))" />
          </div>

          <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3 print:grid-cols-3 print:gap-1">
            <Figure term="Field strength" testId="field-strength">
              <span className="font-mono">{formatQuantity(calibration.fieldStrength, unit)}</span>
              {expected && unit === "µT" ? (
                <span className="text-chart-muted">
                  {" "}
                  against {formatQuantity(expected.fieldStrengthMicrotesla, "µT")} from {expected.modelName} (
                  {formatSigned(percentFrom(calibration.fieldStrength, expected.fieldStrengthMicrotesla), "%")})
                </span>
              ) : (
                <span className="text-chart-muted"> (no site, so no model value to compare)</span>
              )}
            </Figure>
            <Figure term="Residual RMS">
              <span className="font-mono">{formatQuantity(calibration.residualRms, unit)}</span>
              <span className="text-chart-muted"> ({formatQuantity(calibration.residualRmsPercent, "% of field")})</span>
            </Figure>
            <Figure term="Samples">
              {formatNumber(calibration.samplesUsed, 0)} used, {formatNumber(calibration.outliersRejected, 0)} rejected as outliers
              {calibration.nonFiniteSkipped ? `, ${formatNumber(calibration.nonFiniteSkipped, 0)} unreadable` : ""}
              {calibration.rejectedStretches?.length ? (
                <ul className="list-disc pl-4" data-testid="rejected-stretches">
                  {calibration.rejectedStretches.map((stretch) => (
                    <li key={stretch.startIndex}>{rejectedStretchSentence(stretch)}</li>
                  ))}
                </ul>
              ) : null}
            </Figure>
            <Figure term="Coverage">
              {formatQuantity(calibration.coverage.coveredFraction * 100, "% of cells")}, largest gap{" "}
              {formatQuantity(calibration.coverage.largestGapDeg, "°")}
            </Figure>
            <Figure term="Saturation and resolution">
              {saturationFindings(calibration.saturation, unit).length ? (
                <ul className="list-disc pl-4">
                  {saturationFindings(calibration.saturation, unit).map((finding) => (
                    <li key={finding}>{finding}</li>
                  ))}
                </ul>
              ) : (
                "No clipped readings; resolution is fine."
              )}
            </Figure>
            {compass.dip ? (
              <Figure term="Inclination (dip) at rest">
                <span className="font-mono">{formatQuantity(compass.dip.dipDeg, "°")}</span>
                {expected ? (
                  <span className="text-chart-muted"> against {formatQuantity(expected.inclinationDeg, "°")} from the model</span>
                ) : null}
              </Figure>
            ) : null}
            {compass.currentCoupling ? (
              <Figure term={compass.currentCoupling.kind === "current" ? "Field per ampere" : "Field at full throttle"}>
                <span className="font-mono">
                  {compass.currentCoupling.slopePerUnit.map((v) => formatNumber(v, 3)).join(", ")}{" "}
                  {compass.currentCoupling.kind === "current" ? `${unit}/A` : unit} (x, y, z)
                </span>
                <span className="text-chart-muted">
                  ; {formatQuantity(compass.currentCoupling.changeAtMaxMagnitude, unit)} at the largest input,{" "}
                  {formatQuantity(compass.currentCoupling.percentOfField, "% of field")}
                </span>
              </Figure>
            ) : null}
          </dl>
        </>
      )}
      <Mounting compass={compass} />
    </section>
  );
}
