"use client";

import { Bar, BarChart, CartesianGrid, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { AXIS_LINE, GRID, SERIES_COLOURS, TICK, TOOLTIP_STYLE, axisLabel } from "./chart-style";
import { ChartFigure } from "./chart-figure";
import { formatNumber, formatQuantity } from "./format";
import { histogramBars, histogramSpread, niceScale } from "./plot-data";
import { sensorName } from "./sensor-names";

/**
 * How far the corrected readings sit from the fitted sphere, for one compass: a narrow bell
 * around zero is a good fit; a wide or lopsided one is a disturbed site or a model too simple
 * for the soft iron.
 */
export function ResidualHistogramChart({
  sensor,
  edges,
  counts,
  index = 0,
  sensorLabels = {},
}: {
  sensor: string;
  edges: number[];
  counts: number[];
  index?: number;
  sensorLabels?: Record<string, string>;
}) {
  const spread = histogramSpread(edges, counts, 0.9);
  if (!spread) return null;
  const bars = histogramBars(edges, counts);
  const xScale = niceScale(edges[0], edges[edges.length - 1], 6);
  const name = sensorName(sensor, sensorLabels);
  const caption = (
    <>
      Distance of each corrected reading from the fitted sphere for {name}, over {formatNumber(spread.total, 0)} samples: nine in ten lie
      between {formatNumber(spread.low, 2)} and {formatQuantity(spread.high, "µT", 2)}, most near {formatQuantity(spread.peak, "µT", 2)}. A
      narrow peak at zero is a good fit.
    </>
  );
  return (
    <ChartFigure id={`plot-residual-${sensor}`} title={`Residuals, ${name}`} caption={caption} testId="plot-residuals">
      <BarChart
        responsive
        data={bars}
        style={{ width: "100%", height: "100%" }}
        margin={{ top: 8, right: 12, bottom: 18, left: 8 }}
        barCategoryGap={1}
        title={`Residuals, ${name}`}
      >
        <CartesianGrid {...GRID} vertical={false} />
        <XAxis
          dataKey="centre"
          type="number"
          domain={xScale.domain}
          tick={TICK}
          axisLine={AXIS_LINE}
          tickLine={AXIS_LINE}
          ticks={xScale.ticks}
          tickFormatter={(v: number) => formatNumber(v, xScale.decimals)}
          label={axisLabel("Reading − fitted strength (µT)", "x")}
        />
        <YAxis tick={TICK} axisLine={AXIS_LINE} tickLine={AXIS_LINE} width={56} allowDecimals={false} label={axisLabel("Samples", "y")} />
        <ReferenceLine x={0} stroke="currentColor" strokeDasharray="4 4" strokeOpacity={0.7} ifOverflow="hidden" />
        <Tooltip
          {...TOOLTIP_STYLE}
          labelFormatter={(_, payload) => {
            const bar = payload?.[0]?.payload as { low: number; high: number } | undefined;
            return bar ? `${formatNumber(bar.low, 2)} to ${formatQuantity(bar.high, "µT", 2)}` : "";
          }}
          formatter={(value) => [formatNumber(Number(value), 0), "samples"]}
        />
        <Bar dataKey="count" name="Samples" fill={SERIES_COLOURS[index % SERIES_COLOURS.length]} isAnimationActive={false} />
      </BarChart>
    </ChartFigure>
  );
}
