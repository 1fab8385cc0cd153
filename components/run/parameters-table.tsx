import type { AccelerometerAnalysis, GyroscopeAnalysis } from "@/geometry/analyse-capture";
import type { MagnetometerAnalysis } from "@/geometry/magnetometer-analysis";
import { AccelerometerParameters, GyroscopeParameters } from "./inertial-parameters";
import { MagnetometerParameters, type ExpectedField } from "./magnetometer-parameters";
import { fieldUnitOf } from "./parameter-text";
import { sensorName } from "./sensor-names";

export interface ParametersTableProps {
  /** `CaptureAnalysis.magnetometers`. */
  magnetometers: MagnetometerAnalysis[];
  /** `CaptureAnalysis.accelerometers` (or `[accelerometer]` for results that only have the first). */
  accelerometers: AccelerometerAnalysis[];
  gyroscopes: GyroscopeAnalysis[];
  /** The World Magnetic Model's values at the site (`CaptureAnalysis.reference.magnetic`); null without a site. */
  expectedField: ExpectedField | null;
  /** `CaptureAnalysis.units`: a compass whose unit was never known is shown in counts. */
  units?: Record<string, { physical: boolean }>;
  sensorLabels?: Record<string, string>;
}

/**
 * Every fitted parameter of the run: per compass, then accelerometers, then gyroscopes.
 * Server-renderable; prints one sensor per block without splitting a table.
 */
export function ParametersTable({
  magnetometers,
  accelerometers,
  gyroscopes,
  expectedField,
  units,
  sensorLabels = {},
}: ParametersTableProps) {
  const empty = magnetometers.length + accelerometers.length + gyroscopes.length === 0;
  return (
    <section aria-labelledby="parameters-heading" className="space-y-4 print:space-y-2" data-testid="parameters-table">
      <h2 id="parameters-heading" className="text-xl font-semibold">
        Parameters
      </h2>
      {empty ? <p className="text-sm text-chart-muted">No sensor in this capture could be fitted.</p> : null}
      {magnetometers.map((compass) => (
        <MagnetometerParameters
          key={compass.sensor}
          compass={compass}
          name={sensorName(compass.sensor, sensorLabels)}
          expected={expectedField}
          unit={fieldUnitOf(compass.sensor, units)}
        />
      ))}
      {accelerometers.map((accelerometer) => (
        <AccelerometerParameters
          key={accelerometer.sensor}
          accelerometer={accelerometer}
          name={sensorName(accelerometer.sensor, sensorLabels)}
        />
      ))}
      {gyroscopes.map((gyroscope) => (
        <GyroscopeParameters key={gyroscope.sensor} gyroscope={gyroscope} name={sensorName(gyroscope.sensor, sensorLabels)} />
      ))}
    </section>
  );
}
