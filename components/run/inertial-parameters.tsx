import type { AccelerometerAnalysis, GyroscopeAnalysis } from "@/geometry/analyse-capture";
import { degPerS, formatInterval, formatNumber, formatQuantity, formatSigned } from "./format";
import { faceWords, intervalFromSigma, missingFacesText } from "./parameter-text";
import { AXES, Figure, TABLE, TD, TH, TH_AXIS } from "./parameter-parts";

const CARD = "card break-inside-avoid space-y-4 p-5 print:rounded-none print:border-0 print:p-0 print:shadow-none";

function PosesTable({ accelerometer }: { accelerometer: AccelerometerAnalysis }) {
  const missing = missingFacesText(accelerometer.missingFaces);
  const repeated = accelerometer.repeatedFaces ?? [];
  return (
    <div>
      {accelerometer.poses.length ? (
        <table className={TABLE} data-testid="poses">
          <caption className="mb-1 text-left text-sm font-medium">Still holds, in the order they were made</caption>
          <thead>
            <tr>
              <th scope="col" className={TH}>
                Face down
              </th>
              <th scope="col" className={`${TH} text-right`}>
                Held
              </th>
              <th scope="col" className={`${TH} text-right`}>
                Wobble (RMS)
              </th>
              <th scope="col" className={`${TH} text-right`}>
                Angle from nearest axis
              </th>
            </tr>
          </thead>
          <tbody>
            {accelerometer.poses.map((pose) => (
              <tr key={`${pose.face}-${pose.startTimeS}`}>
                <td className="px-2 py-1 text-sm print:px-1 print:text-xs">{faceWords(pose.face)}</td>
                <td className={`${TD} text-right`}>{formatQuantity(pose.durationS, "s")}</td>
                <td className={`${TD} text-right`}>{formatQuantity(pose.wobbleDeg, "°", 2)}</td>
                <td className={`${TD} text-right`}>{formatQuantity(pose.angleFromAxisDeg, "°")}</td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : (
        <p className="text-sm text-chart-muted">No still hold was found in this capture.</p>
      )}
      {missing ? (
        <p className="mt-2 text-sm font-medium" data-testid="missing-faces">
          {missing}
        </p>
      ) : null}
      {repeated.length ? (
        <p className="mt-1 text-sm text-chart-muted">
          Held more than once: {repeated.map((face) => faceWords(face)).join("; ")} (the longest hold of each counts).
        </p>
      ) : null}
    </div>
  );
}

/**
 * An accelerometer's offset and scale per axis and the six-face holds behind them (face,
 * how long, wobble, angle from the nearest axis), with the faces that were never held.
 */
export function AccelerometerParameters({ accelerometer, name }: { accelerometer: AccelerometerAnalysis; name: string }) {
  const calibration = accelerometer.calibration;
  const headingId = `parameters-${accelerometer.sensor}`;
  return (
    <section aria-labelledby={headingId} className={CARD} data-testid="accelerometer-parameters" data-sensor={accelerometer.sensor}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-lg font-semibold">
          {name}
        </h3>
        <p className="text-sm">
          <span className="text-chart-muted">Model used: </span>
          <span className="font-medium">
            {calibration.ok
              ? calibration.model === "full"
                ? "Offset, scale and misalignment"
                : "Offset and per-axis scale"
              : "none — fit refused"}
          </span>
        </p>
      </div>
      {calibration.ok ? (
        <>
          <p className="text-sm">
            <span className="font-medium">Why this model: </span>
            {calibration.modelReason}
          </p>
          <table className={`${TABLE} max-w-2xl`} data-testid="accelerometer-per-axis">
            <caption className="mb-1 text-left text-sm font-medium">Per axis (intervals from the pose geometry)</caption>
            <thead>
              <tr>
                <th scope="col" className={TH}>
                  Axis
                </th>
                <th scope="col" className={`${TH} text-right`}>
                  Offset
                </th>
                <th scope="col" className={`${TH} text-right`}>
                  95% interval
                </th>
                <th scope="col" className={`${TH} text-right`}>
                  Scale
                </th>
                <th scope="col" className={`${TH} text-right`}>
                  From 1
                </th>
              </tr>
            </thead>
            <tbody>
              {AXES.map((axis, i) => (
                <tr key={axis}>
                  <th scope="row" className={TH_AXIS}>
                    {axis}
                  </th>
                  <td className={`${TD} text-right`}>{formatQuantity(calibration.offset[i], "m/s²")}</td>
                  <td className={`${TD} text-right`}>
                    {formatInterval(intervalFromSigma(calibration.offset[i], calibration.offsetSigma[i]), "m/s²")}
                  </td>
                  <td className={`${TD} text-right`}>{formatNumber(calibration.scale[i], 4)}</td>
                  <td className={`${TD} text-right`}>{formatSigned((calibration.scale[i] - 1) * 100, "%", 2)}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-3 print:grid-cols-3 print:gap-1">
            <Figure term="Gravity fitted to">
              <span className="font-mono">{formatQuantity(calibration.gravityMps2, "m/s²")}</span>
              <span className="text-chart-muted"> (read before scaling: {formatQuantity(calibration.rawGravityMps2, "m/s²")})</span>
            </Figure>
            <Figure term="Residual RMS">
              <span className="font-mono">{formatQuantity(calibration.residualRmsMps2, "m/s²")}</span> over {calibration.posesUsed} poses
            </Figure>
            {calibration.levelTrim ? (
              <Figure term="Board attitude when level">
                roll {formatQuantity(calibration.levelTrim.rollDeg, "°")}, pitch {formatQuantity(calibration.levelTrim.pitchDeg, "°")}
              </Figure>
            ) : null}
            {calibration.model === "full" ? (
              <Figure term="Misalignment (xy, xz, yz)">
                {calibration.misalignmentDeg.map((v) => formatQuantity(v, "°", 2)).join(", ")}
              </Figure>
            ) : null}
          </dl>
        </>
      ) : (
        <div
          className="rounded-lg border border-halt/40 bg-halt-soft p-3 text-sm print:border-chart-ink print:bg-transparent"
          data-testid="fit-refused"
        >
          <p className="font-semibold">No accelerometer calibration was fitted ({calibration.reason.replace(/-/g, " ")}).</p>
          <p className="mt-1">{calibration.detail}</p>
        </div>
      )}
      <PosesTable accelerometer={accelerometer} />
    </section>
  );
}

/** A gyroscope's bias and noise at rest, per axis, in °/s. */
export function GyroscopeParameters({ gyroscope, name }: { gyroscope: GyroscopeAnalysis; name: string }) {
  const result = gyroscope.result;
  const headingId = `parameters-${gyroscope.sensor}`;
  return (
    <section aria-labelledby={headingId} className={CARD} data-testid="gyroscope-parameters" data-sensor={gyroscope.sensor}>
      <h3 id={headingId} className="text-lg font-semibold">
        {name}
      </h3>
      {result.ok ? (
        <>
          <table className={`${TABLE} max-w-md`}>
            <caption className="mb-1 text-left text-sm font-medium">At rest, per axis</caption>
            <thead>
              <tr>
                <th scope="col" className={TH}>
                  Axis
                </th>
                <th scope="col" className={`${TH} text-right`}>
                  Bias
                </th>
                <th scope="col" className={`${TH} text-right`}>
                  Noise (RMS)
                </th>
              </tr>
            </thead>
            <tbody>
              {AXES.map((axis, i) => (
                <tr key={axis}>
                  <th scope="row" className={TH_AXIS}>
                    {axis}
                  </th>
                  <td className={`${TD} text-right`}>{formatQuantity(degPerS(result.biasRadPerS[i]), "°/s")}</td>
                  <td className={`${TD} text-right`}>{formatQuantity(degPerS(result.noiseRadPerS[i]), "°/s")}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="text-sm">
            Bias {formatQuantity(degPerS(result.biasMagnitudeRadPerS), "°/s")} in all, moving by up to{" "}
            {formatQuantity(degPerS(result.biasDriftRadPerS), "°/s")} between holds; from {formatNumber(result.samplesUsed, 0)} samples in{" "}
            {result.periodsUsed} still period{result.periodsUsed === 1 ? "" : "s"}.
          </p>
        </>
      ) : (
        <p className="text-sm text-chart-muted" data-testid="fit-refused">
          Not measured: {result.detail}.
        </p>
      )}
    </section>
  );
}
