import { slotWords } from "@/geometry/sensor-slots";
import type { RunViewMagnetometer } from "@/geometry/run-view";
import {
  MAP_HALF_HEIGHT,
  MAP_HALF_WIDTH,
  projectDirection,
  projectLonLat,
  projectOutline,
  projectRegion,
  type MapPoint,
} from "@/geometry/equal-area-map";
import { capBoundary } from "@/geometry/spherical-cap";
import { describeCells } from "@/geometry/sphere-cells";
import type { Vec3 } from "@/geometry/types";
import { bandIndex, coverageBands } from "./coverage-bands";
import { CELL_TINT_CLASS, CoverageLegend, EMPTY_TINT_CLASS, EmptyHatch, useSvgId } from "./coverage-legend";
import { summariseCoverage } from "./coverage-summary";

/*
 * The whole sphere of field directions on one flat, equal-area map (Hammer; why, in
 * geometry/equal-area-map.ts): every cell keeps its true share of the area, so a gap reads
 * at its real size without turning the globe. Server-renderable: no window, no effects.
 */

/** SVG units per map unit; y is flipped, the map's y being up. */
const SCALE = 100;
const svgPoint = ([x, y]: MapPoint) => `${(x * SCALE).toFixed(1)} ${(-y * SCALE).toFixed(1)}`;
const polygonPath = (pieces: MapPoint[][]) => pieces.map((p) => `M${p.map(svgPoint).join("L")}Z`).join("");
const linePath = (pieces: MapPoint[][]) => pieces.map((p) => `M${p.map(svgPoint).join("L")}`).join("");

const cellPaths = new Map<number, string[]>();

/** Map outlines of every cell at a resolution, computed once per resolution. */
function cellPathsFor(gridResolution: number): string[] {
  let paths = cellPaths.get(gridResolution);
  if (!paths) {
    paths = describeCells(gridResolution, 8).map((cell) => polygonPath(projectRegion(cell.boundary)));
    cellPaths.set(gridResolution, paths);
  }
  return paths;
}

function meridian(lonDeg: number): string {
  const points: MapPoint[] = [];
  for (let lat = -90; lat <= 90; lat += 5) points.push(projectLonLat((lonDeg * Math.PI) / 180, (lat * Math.PI) / 180));
  return linePath([points]);
}

/** Body axes where they land on the map, with where their label sits. */
const AXES: { label: string; direction: Vec3; dx: number; dy: number; anchor: "start" | "middle" | "end" }[] = [
  { label: "+x forward", direction: [1, 0, 0], dx: 7, dy: -7, anchor: "start" },
  { label: "+y right", direction: [0, 1, 0], dx: 0, dy: -9, anchor: "middle" },
  { label: "−y left", direction: [0, -1, 0], dx: 0, dy: -9, anchor: "middle" },
  { label: "−z up", direction: [0, 0, -1], dx: 0, dy: -10, anchor: "middle" },
  { label: "+z down", direction: [0, 0, 1], dx: 0, dy: 18, anchor: "middle" },
  { label: "−x back", direction: [-1, 1e-9, 0], dx: -4, dy: 16, anchor: "end" },
  { label: "−x back", direction: [-1, -1e-9, 0], dx: 4, dy: 16, anchor: "start" },
];

export interface CoverageMapProps {
  magnetometer: RunViewMagnetometer;
  /** A person's name for the compass ("Compass B · mast module"); the slot in words otherwise. */
  sensorLabel?: string;
  /** Leave out the legend (when one is shown beside it already). */
  legend?: boolean;
  className?: string;
}

export function CoverageMap({ magnetometer, sensorLabel, legend = true, className }: CoverageMapProps) {
  const hatchId = useSvgId("map-hatch");
  const rimId = useSvgId("map-rim");
  const summary = summariseCoverage(magnetometer);
  const name = sensorLabel ?? slotWords(magnetometer.sensor);
  const { cellCounts, gridResolution, minSamplesPerCell, largestGapDeg, gapCentre } = magnetometer;
  if (!summary || !cellCounts || !gridResolution) {
    return <p className="text-sm text-chart-muted">No coverage was measured for {name}, so there is no map to draw.</p>;
  }
  const minimum = minSamplesPerCell ?? 1;
  const bands = coverageBands(minimum, Math.max(0, ...cellCounts));
  const paths = cellPathsFor(gridResolution);
  const gap =
    largestGapDeg !== null && gapCentre
      ? { rim: linePath(projectOutline(capBoundary(gapCentre, largestGapDeg, 180), true)), centre: projectDirection(gapCentre) }
      : null;
  const w = MAP_HALF_WIDTH * SCALE;
  const h = MAP_HALF_HEIGHT * SCALE;

  return (
    <figure className={className}>
      <svg
        viewBox={`${-w - 30} ${-h - 24} ${2 * w + 60} ${2 * h + 50}`}
        className="h-auto w-full"
        role="img"
        aria-label={`Flat equal-area map of field directions for ${name}: ${summary.sentence}.`}
        data-testid="coverage-map"
      >
        <defs>
          <EmptyHatch id={hatchId} />
          <clipPath id={rimId}>
            <ellipse cx="0" cy="0" rx={w} ry={h} />
          </clipPath>
        </defs>
        <ellipse cx="0" cy="0" rx={w} ry={h} className="fill-chart-paper" />
        <g strokeLinejoin="round">
          {paths.map((d, index) => {
            const band = bandIndex(cellCounts[index] ?? 0, bands);
            return band < 0 ? (
              <path key={index} d={d} fill={`url(#${hatchId})`} stroke="currentColor" strokeWidth="0.9" className={EMPTY_TINT_CLASS} />
            ) : (
              <path
                key={index}
                d={d}
                fill="currentColor"
                fillOpacity={bands[band].opacity}
                className={`${CELL_TINT_CLASS} stroke-chart-sheet`}
                strokeWidth="0.6"
              />
            );
          })}
        </g>
        <g clipPath={`url(#${rimId})`} fill="none" className="stroke-chart-ink" strokeOpacity="0.35" strokeWidth="0.8">
          <path d={`M${-w} 0H${w}`} />
          <path d={meridian(0)} />
          <path d={meridian(90)} />
          <path d={meridian(-90)} />
        </g>
        <ellipse cx="0" cy="0" rx={w} ry={h} fill="none" className="stroke-chart-ink" strokeOpacity="0.6" strokeWidth="1.2" />
        {gap ? (
          <g className="text-chart-ink" stroke="currentColor" fill="none">
            <path d={gap.rim} strokeWidth="1.8" strokeDasharray="6 4" />
            <g transform={`translate(${svgPoint(gap.centre).replace(" ", ",")})`}>
              <circle r="5" className="fill-chart-sheet" strokeWidth="1.4" />
              <path d="M-3 0H3M0 -3V3" strokeWidth="1.4" />
            </g>
          </g>
        ) : null}
        <g className="fill-chart-ink text-[11px]" fontFamily="inherit">
          {AXES.map((axis) => {
            const [x, y] = projectDirection(axis.direction);
            return (
              <g key={`${axis.label}${axis.anchor}`}>
                <circle cx={x * SCALE} cy={-y * SCALE} r="2.6" className="fill-chart-ink" />
                <text
                  x={x * SCALE + axis.dx}
                  y={-y * SCALE + axis.dy}
                  textAnchor={axis.anchor}
                  className="fill-chart-ink font-semibold"
                  paintOrder="stroke"
                  stroke="rgb(var(--chart-sheet))"
                  strokeWidth="3"
                >
                  {axis.label}
                </text>
              </g>
            );
          })}
        </g>
      </svg>
      <figcaption className="mt-2 space-y-2 text-xs text-chart-muted">
        <p>
          <span className="font-semibold text-chart-ink">{summary.sentence}.</span> The whole sphere of field directions for {name},
          flattened with equal areas (Hammer map): the nose at the centre, up at the top, the tail split between both ends.
        </p>
        {legend ? <CoverageLegend bands={bands} minSamplesPerCell={minimum} gap={gap !== null} /> : null}
      </figcaption>
    </figure>
  );
}
