/**
 * The plots' look. Colours are mid-tones of the product's palette that keep a 3:1 contrast on
 * both the light and the dark sheet; every series also differs by dash or marker shape, so no
 * plot reads by colour alone. Text and rules follow `currentColor`, set by the figure from the
 * theme's CSS variables.
 */
import type { SymbolType } from "recharts";
import { formatNumber } from "./format";

export const SERIES_COLOURS = ["#4e9a95", "#c27c2c", "#7d6fc0", "#4b7fb0"] as const;
export const SERIES_DASHES = [undefined, "6 3", "2 3", "8 3 2 3"] as const;

/** Body axes in the coupling plot: colour, marker and dash together. */
export const AXIS_STYLE = {
  x: { colour: "#4e9a95", shape: "circle" as SymbolType, dash: undefined },
  y: { colour: "#c27c2c", shape: "triangle" as SymbolType, dash: "6 3" },
  z: { colour: "#7d6fc0", shape: "square" as SymbolType, dash: "2 3" },
} as const;

export const BAND_FILL = "#4e9a95";
export const POSE_FILL = "#c27c2c";

export const TICK = { fill: "currentColor", fontSize: 11 };
export const GRID = { stroke: "currentColor", strokeOpacity: 0.18 };
export const AXIS_LINE = { stroke: "currentColor", strokeOpacity: 0.5 };
export const TOOLTIP_STYLE = {
  contentStyle: {
    background: "rgb(var(--chart-sheet))",
    border: "1px solid rgb(var(--chart-rule))",
    borderRadius: 8,
    color: "rgb(var(--chart-ink))",
    fontSize: 12,
  },
  labelStyle: { color: "rgb(var(--chart-ink))" },
  itemStyle: { color: "rgb(var(--chart-ink))" },
};

/** An axis title in the chart's text colour. */
export function axisLabel(value: string, axis: "x" | "y") {
  return axis === "x"
    ? { value, position: "insideBottom" as const, offset: -4, fill: "currentColor", fontSize: 12 }
    : { value, angle: -90, position: "insideLeft" as const, style: { textAnchor: "middle" as const }, fill: "currentColor", fontSize: 12 };
}

/** The time axis every time plot shares: seconds from the start of the capture. */
export function timeAxisProps(scale: { domain: [number, number]; ticks: number[]; decimals: number }) {
  return {
    dataKey: "timeS",
    type: "number" as const,
    domain: scale.domain,
    ticks: scale.ticks,
    tick: TICK,
    axisLine: AXIS_LINE,
    tickLine: AXIS_LINE,
    tickFormatter: (v: number) => formatNumber(v, scale.decimals),
    label: axisLabel("Time (s)", "x"),
  };
}
