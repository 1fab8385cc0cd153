"use client";

import { CartesianGrid, Legend, ReferenceLine, Scatter, ScatterChart, Tooltip, XAxis, YAxis, ZAxis } from "recharts";
import type { RunView } from "@/geometry/run-view";
import { AXIS_LINE, AXIS_STYLE, GRID, TICK, TOOLTIP_STYLE, axisLabel } from "./chart-style";
import { ChartFigure } from "./chart-figure";
import { formatNumber, formatQuantity } from "./format";
import { interceptWithSlope, scatterPoints, slopeSegment } from "./plot-data";
import { sensorName } from "./sensor-names";

const AXES = ["x", "y", "z"] as const;

/**
 * Field change against motor current (or throttle) per body axis, with the fitted straight
 * lines: steep lines mean power wiring too close to the compass.
 */
export function CouplingChart({
  coupling,
  sensorLabels = {},
}: {
  coupling: RunView["coupling"][number];
  sensorLabels?: Record<string, string>;
}) {
  if (coupling.x.length === 0) return null;
  const byCurrent = coupling.input === "current";
  // Throttle may be logged in percent while its slope is per full throttle (0–1).
  const maxInput = Math.max(...coupling.x);
  const inputScale = !byCurrent && maxInput > 1.5 ? 0.01 : 1;
  // Each axis is drawn from its own fitted motors-off level, so points and line share a zero.
  const changes = Object.fromEntries(
    AXES.map((axis, i) => {
      const raw = { x: coupling.dx, y: coupling.dy, z: coupling.dz }[axis];
      const level = interceptWithSlope(coupling.x, raw, coupling.slope[i] * inputScale) ?? 0;
      return [axis, raw.map((d) => d - level)];
    }),
  ) as Record<(typeof AXES)[number], number[]>;
  const name = sensorName(coupling.sensor, sensorLabels);
  const unitPer = byCurrent ? "µT/A" : "µT per full throttle";
  const atMax = Math.hypot(...coupling.slope) * maxInput * inputScale;
  const title = `Field change with ${byCurrent ? "motor current" : "throttle"}, ${name}`;
  const caption = (
    <>
      Change of the corrected field from its fitted motors-off value against {byCurrent ? "motor current" : "throttle"}, per body axis, with
      the fitted lines: {AXES.map((axis, i) => `${axis} ${formatNumber(coupling.slope[i], 3)}`).join(", ")} {unitPer}. At the largest{" "}
      {byCurrent ? `current, ${formatQuantity(maxInput, "A")},` : "throttle"} the field moves by {formatQuantity(atMax, "µT")}.
    </>
  );
  return (
    <ChartFigure id={`plot-coupling-${coupling.sensor}`} title={title} caption={caption} testId="plot-coupling">
      <ScatterChart responsive style={{ width: "100%", height: "100%" }} margin={{ top: 8, right: 12, bottom: 18, left: 8 }} title={title}>
        <CartesianGrid {...GRID} />
        <XAxis
          dataKey="x"
          type="number"
          domain={[0, "dataMax"]}
          tick={TICK}
          axisLine={AXIS_LINE}
          tickLine={AXIS_LINE}
          tickFormatter={(v: number) => formatNumber(v, byCurrent ? 0 : 2)}
          label={axisLabel(byCurrent ? "Motor current (A)" : inputScale === 1 ? "Throttle (0–1)" : "Throttle (%)", "x")}
        />
        <YAxis
          dataKey="y"
          type="number"
          tick={TICK}
          axisLine={AXIS_LINE}
          tickLine={AXIS_LINE}
          width={56}
          label={axisLabel("Field change (µT)", "y")}
        />
        {/* Small markers, so the fitted lines show through the cloud. */}
        <ZAxis range={[18, 18]} />
        <Tooltip {...TOOLTIP_STYLE} cursor={{ strokeDasharray: "3 3" }} formatter={(value) => formatNumber(Number(value), 2)} />
        <Legend wrapperStyle={{ fontSize: 12, paddingTop: 8 }} />
        {AXES.map((axis) => (
          <Scatter
            key={axis}
            name={`${axis} axis`}
            data={scatterPoints(coupling.x, changes[axis])}
            fill={AXIS_STYLE[axis].colour}
            fillOpacity={0.55}
            shape={AXIS_STYLE[axis].shape}
            legendType={AXIS_STYLE[axis].shape}
            isAnimationActive={false}
          />
        ))}
        {AXES.map((axis, i) => {
          const segment = slopeSegment(coupling.slope[i] * inputScale, coupling.x);
          return segment ? (
            <ReferenceLine
              key={`fit-${axis}`}
              segment={segment}
              stroke={AXIS_STYLE[axis].colour}
              strokeWidth={2}
              strokeDasharray={AXIS_STYLE[axis].dash}
              ifOverflow="extendDomain"
            />
          ) : null;
        })}
      </ScatterChart>
    </ChartFigure>
  );
}
