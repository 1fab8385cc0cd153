"use client";

import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { AXIS_LINE, GRID, POSE_FILL, SERIES_COLOURS, TICK, TOOLTIP_STYLE, axisLabel, timeAxisProps } from "./chart-style";
import { ChartFigure } from "./chart-figure";
import { formatNumber, formatQuantity } from "./format";
import { faceWords } from "./parameter-text";
import { niceScale, timeAxis, timeRows, unlabelledStillPeriods, type PlotData } from "./plot-data";

/**
 * Accelerometer magnitude over the capture with the still holds shaded and named by the face
 * that was down: flat stretches at gravity are good holds; a ragged one is a wobbly hand.
 */
export function AccelerationChart({ data, gravityMps2 }: { data: PlotData; gravityMps2?: number | null }) {
  const { timeS, accelMagnitude } = data.series;
  if (!accelMagnitude || accelMagnitude.length === 0 || timeS.length === 0) return null;
  const rows = timeRows(timeS, { accel: accelMagnitude });
  const timeScale = timeAxis(timeS);
  const finite = accelMagnitude.filter((v) => Number.isFinite(v));
  const yScale = niceScale(Math.min(...finite, gravityMps2 ?? Infinity), Math.max(...finite, gravityMps2 ?? -Infinity), 5);
  const others = unlabelledStillPeriods(data.stillPeriods, data.poses);
  const faces = data.poses.map((pose) => faceWords(pose.face).split(",")[1]?.trim() ?? pose.face);
  const caption = (
    <>
      Magnitude of the accelerometer reading over {formatQuantity(timeS[timeS.length - 1] - timeS[0], "s", 0)}
      {gravityMps2 ? <>, against the site’s gravity of {formatQuantity(gravityMps2, "m/s²")} (dashed line)</> : null}.{" "}
      {data.poses.length
        ? `${data.poses.length} still hold${data.poses.length === 1 ? "" : "s"} detected, shaded and labelled by the face down: ${faces.join(", ")}.`
        : "No still hold was detected."}
      {others.length ? ` ${others.length} other still stretch${others.length === 1 ? "" : "es"} shaded lighter.` : ""}
    </>
  );
  return (
    <ChartFigure id="plot-acceleration" title="Accelerometer magnitude over time" caption={caption} testId="plot-acceleration">
      <LineChart
        responsive
        data={rows}
        style={{ width: "100%", height: "100%" }}
        margin={{ top: 20, right: 12, bottom: 18, left: 8 }}
        title="Accelerometer magnitude over time"
      >
        <CartesianGrid {...GRID} />
        <XAxis {...timeAxisProps(timeScale)} />
        <YAxis
          domain={yScale.domain}
          ticks={yScale.ticks}
          tick={TICK}
          axisLine={AXIS_LINE}
          tickLine={AXIS_LINE}
          width={56}
          tickFormatter={(v: number) => formatNumber(v, yScale.decimals)}
          label={axisLabel("Acceleration (m/s²)", "y")}
        />
        {others.map((period) => (
          <ReferenceArea
            key={`still-${period.startS}`}
            x1={period.startS}
            x2={period.endS}
            fill="currentColor"
            fillOpacity={0.08}
            ifOverflow="hidden"
          />
        ))}
        {data.poses.map((pose) => (
          <ReferenceArea
            key={`pose-${pose.startS}`}
            x1={pose.startS}
            x2={pose.endS}
            fill={POSE_FILL}
            fillOpacity={0.18}
            ifOverflow="hidden"
            label={{ value: pose.face.replace("-", "\u2212"), position: "top", fill: "currentColor", fontSize: 11 }}
          />
        ))}
        {gravityMps2 ? <ReferenceLine y={gravityMps2} stroke="currentColor" strokeDasharray="4 4" strokeOpacity={0.7} /> : null}
        <Tooltip
          {...TOOLTIP_STYLE}
          labelFormatter={(t) => `t = ${formatQuantity(Number(t), "s", 2)}`}
          formatter={(value) => [formatQuantity(Number(value), "m/s²"), "magnitude"]}
        />
        <Line dataKey="accel" name="Magnitude" stroke={SERIES_COLOURS[0]} strokeWidth={1.25} dot={false} isAnimationActive={false} />
      </LineChart>
    </ChartFigure>
  );
}
