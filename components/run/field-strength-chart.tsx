"use client";

import { CartesianGrid, Legend, Line, LineChart, ReferenceArea, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { AXIS_LINE, BAND_FILL, GRID, SERIES_COLOURS, SERIES_DASHES, TICK, TOOLTIP_STYLE, axisLabel, timeAxisProps } from "./chart-style";
import { ChartFigure } from "./chart-figure";
import { formatNumber, formatQuantity } from "./format";
import { fractionInBand, niceScale, timeAxis, timeRows, type PlotData } from "./plot-data";
import { sensorName } from "./sensor-names";

/**
 * Field strength of each compass over the capture against the band the World Magnetic Model
 * expects at the site: a steady line inside the band is a good site and a good fit; a line that
 * wanders out of it is steel nearby, a current, or a fit that did not take.
 */
export function FieldStrengthChart({ data, sensorLabels = {} }: { data: PlotData; sensorLabels?: Record<string, string> }) {
  const { timeS, fieldStrength } = data.series;
  const sensors = Object.keys(fieldStrength).filter((sensor) => fieldStrength[sensor]?.length);
  if (timeS.length === 0 || sensors.length === 0) return null;
  const rows = timeRows(timeS, fieldStrength);
  const expected = data.expectedField;

  let low = Infinity;
  let high = -Infinity;
  for (const sensor of sensors)
    for (const v of fieldStrength[sensor]) {
      if (v < low) low = v;
      if (v > high) high = v;
    }
  if (expected) {
    low = Math.min(low, expected.low);
    high = Math.max(high, expected.high);
  }
  const yScale = niceScale(low, high, 5);
  const timeScale = timeAxis(timeS);

  const shares = expected
    ? sensors.map((sensor) => {
        const share = fractionInBand(fieldStrength[sensor], expected.low, expected.high);
        return `${sensorName(sensor, sensorLabels)}: ${formatQuantity(share === null ? null : share * 100, "%")} of samples inside it`;
      })
    : [];
  const caption = expected ? (
    <>
      Corrected field strength over {formatQuantity(timeS[timeS.length - 1] - timeS[0], "s", 0)} against the World Magnetic Model’s{" "}
      {formatQuantity(expected.strength, "µT")} for the site (dashed line); the shaded band, {formatNumber(expected.low, 1)} to{" "}
      {formatQuantity(expected.high, "µT")}, is the warning limit. {shares.join("; ")}.
    </>
  ) : (
    <>Corrected field strength over the capture. No site was given, so there is no expected value to draw.</>
  );

  return (
    <ChartFigure id="plot-field-strength" title="Field strength over time" caption={caption} testId="plot-field-strength">
      <LineChart
        responsive
        data={rows}
        style={{ width: "100%", height: "100%" }}
        margin={{ top: 8, right: 12, bottom: 18, left: 8 }}
        title="Field strength over time"
      >
        <CartesianGrid {...GRID} />
        <XAxis {...timeAxisProps(timeScale)} />
        <YAxis
          domain={yScale.domain}
          ticks={yScale.ticks}
          tickFormatter={(v: number) => formatNumber(v, yScale.decimals)}
          tick={TICK}
          axisLine={AXIS_LINE}
          tickLine={AXIS_LINE}
          width={56}
          label={axisLabel("Field strength (µT)", "y")}
        />
        {expected ? (
          <>
            <ReferenceArea y1={expected.low} y2={expected.high} fill={BAND_FILL} fillOpacity={0.14} ifOverflow="extendDomain" />
            <ReferenceLine y={expected.strength} stroke="currentColor" strokeDasharray="4 4" strokeOpacity={0.7} />
          </>
        ) : null}
        <Tooltip
          {...TOOLTIP_STYLE}
          labelFormatter={(t) => `t = ${formatQuantity(Number(t), "s", 2)}`}
          formatter={(value) => formatQuantity(Number(value), "µT")}
        />
        <Legend wrapperStyle={{ fontSize: 12, paddingTop: 8 }} />
        {sensors.map((sensor, i) => (
          <Line
            key={sensor}
            dataKey={sensor}
            name={sensorName(sensor, sensorLabels)}
            stroke={SERIES_COLOURS[i % SERIES_COLOURS.length]}
            strokeDasharray={SERIES_DASHES[i % SERIES_DASHES.length]}
            strokeWidth={1.5}
            dot={false}
            isAnimationActive={false}
          />
        ))}
      </LineChart>
    </ChartFigure>
  );
}
