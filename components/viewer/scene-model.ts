/**
 * Everything the sphere view draws, in scene units, from a run's view data: built once per
 * change of data and shared by every canvas (raw and corrected side by side). Pure: flat
 * Float32Arrays and small tuples, no three.
 *
 * Scene units: µT divided by the chosen compass's field strength, so its fitted sphere has
 * radius 1 and the camera's distances mean the same for every run. Things drawn on the
 * coverage surface are built on the unit sphere and carried onto the fitted sphere or the raw
 * ellipsoid by `surface` (a linear map and a centre).
 */
import { fitEllipsoidAlgebraic } from "@/geometry/ellipsoid-fit";
import { ellipsoidSurface } from "@/geometry/ellipsoid-surface";
import { describeCells } from "@/geometry/sphere-cells";
import type { RunView, RunViewMagnetometer } from "@/geometry/run-view";
import type { Mat3, Vec3 } from "@/geometry/types";
import { identity3, scale, scaleMat } from "@/geometry/vector";
import { coverageBands, type CoverageBand } from "./coverage-bands";
import {
  capRibbon,
  cloudSpread,
  coveredCellMesh,
  emptyCellMesh,
  pairedDirectionBuffers,
  scaledPositions,
  wireframeSegments,
} from "./scene-buffers";

export type CloudKind = "raw" | "corrected";

export interface SceneSurface {
  /** Unit sphere → scene: p = centre + linear·u. */
  linear: Mat3;
  centre: Vec3;
  /**
   * "fit": the calibration's sphere or ellipsoid; "rough": a stand-in for a refused compass,
   * the least-squares sphere through its raw points (the centre its rough coverage was
   * counted about), or their spread when even that fails.
   */
  source: "fit" | "rough";
}

export interface SceneModel {
  /** Scene units per µT. */
  scale: number;
  clouds: { sensor: string; raw: Float32Array; corrected: Float32Array | null }[];
  surfaces: { raw: SceneSurface; corrected: SceneSurface | null };
  wireframe: Float32Array;
  coverage: {
    bands: CoverageBand[];
    minSamplesPerCell: number;
    covered: { positions: Float32Array; colours: Float32Array };
    empty: { positions: Float32Array; outline: Float32Array; cellCount: number };
  } | null;
  gap: { rim: Float32Array; marker: Float32Array; dot: Float32Array; centre: Vec3; radiusDeg: number } | null;
  pairs: { sensors: string[]; firstDots: Float32Array; otherDots: Float32Array; links: Float32Array } | null;
}

/** Radii on the unit sphere: cells just inside the points, marks just outside. */
export const CELL_RADIUS = 0.985;
export const MARK_RADIUS = 1.012;
export const PAIR_RADIUS = 1.07;

/** Centre and radius of the algebraic sphere through flat x,y,z triples, as the server's rough coverage uses; the spread if it fails. */
function roughSphere(flat: number[]): { centre: Vec3; radius: number } {
  const n = Math.floor(flat.length / 3);
  const series = { x: new Float64Array(n), y: new Float64Array(n), z: new Float64Array(n) };
  for (let i = 0; i < n; i++) {
    series.x[i] = flat[3 * i];
    series.y[i] = flat[3 * i + 1];
    series.z[i] = flat[3 * i + 2];
  }
  const fit = n >= 5 ? fitEllipsoidAlgebraic(series, "sphere") : null;
  if (fit?.ok && fit.estimate.fieldStrength > 0) return { centre: fit.estimate.hardIronOffset, radius: fit.estimate.fieldStrength };
  return cloudSpread(flat);
}

function rawSurface(m: RunViewMagnetometer, s: number): SceneSurface {
  if (m.hardIronOffset && m.softIronMatrix && m.fieldStrength) {
    try {
      const surface = ellipsoidSurface(m.hardIronOffset, m.softIronMatrix, m.fieldStrength);
      return { linear: scaleMat(surface.linear, s), centre: scale(surface.centre, s), source: "fit" };
    } catch {
      // A singular matrix has no ellipsoid; fall through to the stand-in sphere.
    }
  }
  const rough = roughSphere(m.raw);
  return { linear: scaleMat(identity3(), rough.radius * s), centre: scale(rough.centre, s), source: "rough" };
}

export function buildSceneModel(view: RunView, sensor: string): SceneModel | null {
  const chosen = view.magnetometers.find((m) => m.sensor === sensor) ?? view.magnetometers[0];
  if (!chosen) return null;
  const raw = chosen.fieldStrength && chosen.fieldStrength > 0 ? null : roughSphere(chosen.raw);
  const reference = raw ? raw.radius : chosen.fieldStrength!;
  const s = 1 / reference;
  const clouds = view.magnetometers.map((m) => ({
    sensor: m.sensor,
    raw: scaledPositions(m.raw, s),
    corrected: m.corrected ? scaledPositions(m.corrected, s) : null,
  }));
  const corrected: SceneSurface | null = chosen.corrected
    ? { linear: scaleMat(identity3(), (chosen.fieldStrength ?? reference) * s), centre: [0, 0, 0], source: "fit" }
    : null;

  let coverage: SceneModel["coverage"] = null;
  let gap: SceneModel["gap"] = null;
  if (chosen.cellCounts && chosen.gridResolution) {
    const minimum = chosen.minSamplesPerCell ?? 1;
    const bands = coverageBands(minimum, Math.max(0, ...chosen.cellCounts));
    const cells = describeCells(chosen.gridResolution, 4);
    coverage = {
      bands,
      minSamplesPerCell: minimum,
      covered: coveredCellMesh(cells, chosen.cellCounts, bands, [1, 1, 1], CELL_RADIUS),
      empty: emptyCellMesh(cells, chosen.cellCounts, bands, CELL_RADIUS),
    };
  }
  if (chosen.gapCentre && chosen.largestGapDeg !== null) {
    gap = {
      rim: capRibbon(chosen.gapCentre, chosen.largestGapDeg, 0.7, MARK_RADIUS, 120, [4, 2]),
      marker: capRibbon(chosen.gapCentre, 3, 0.7, MARK_RADIUS, 32),
      dot: capRibbon(chosen.gapCentre, 0.6, 0.6, MARK_RADIUS, 16),
      centre: chosen.gapCentre,
      radiusDeg: chosen.largestGapDeg,
    };
  }
  const pairs = view.pairedDirections
    ? { sensors: view.pairedDirections.sensors, ...pairedDirectionBuffers(view.pairedDirections.directions, PAIR_RADIUS) }
    : null;

  return { scale: s, clouds, surfaces: { raw: rawSurface(chosen, s), corrected }, wireframe: wireframeSegments(), coverage, gap, pairs };
}
