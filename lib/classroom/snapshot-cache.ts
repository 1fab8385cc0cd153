import "server-only";
import { captureDateAtNoonUtc } from "@/geometry/capture-date";
import type { CaptureUnits } from "@/geometry/capture-units";
import { liveSnapshot } from "@/geometry/live-snapshot";
import { scenarioCaptureSpec, scenarioMagnetometerRanges, type ScenarioSpec } from "@/geometry/scenario";
import { simulateCapture } from "@/geometry/simulator";
import type { ColumnTable } from "@/geometry/types";
import { toJsonSafe } from "@/lib/jobs/results-json";

/**
 * Per-process caches behind the live view. Simulating a scenario and analysing a prefix of it
 * are the costly steps, so each is done once per process: the table per scenario spec, the
 * snapshot JSON per (spec, position). Sixty viewers of one session cost one analysis per tick.
 */

/** The units the simulator writes, stated rather than guessed. */
export const SCENARIO_UNITS: CaptureUnits = {
  magnetic: { kind: "magnetic", unit: "uT" },
  acceleration: { kind: "acceleration", unit: "m/s2" },
  rate: { kind: "rate", unit: "rad/s" },
  time: { kind: "time", unit: "s" },
  current: { kind: "current", unit: "A" },
};

/** JSON with object keys in sorted order, so the same spec gives the same key however it was stored (JSONB reorders keys). */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value) ?? "null";
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, inner]) => inner !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([key, inner]) => `${JSON.stringify(key)}:${canonicalJson(inner)}`).join(",")}}`;
}

/** A small least-recently-used map: a Map keeps insertion order, so the first key is the oldest. */
class Lru<V> {
  private readonly entries = new Map<string, V>();
  constructor(private readonly capacity: number) {}
  get(key: string): V | undefined {
    const value = this.entries.get(key);
    if (value !== undefined) {
      this.entries.delete(key);
      this.entries.set(key, value);
    }
    return value;
  }
  set(key: string, value: V): void {
    this.entries.delete(key);
    this.entries.set(key, value);
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
  }
  clear(): void {
    this.entries.clear();
  }
}

interface Caches {
  tables: Lru<ColumnTable>;
  snapshots: Lru<string>;
  counts: { tablesBuilt: number; snapshotsBuilt: number };
}

const g = globalThis as unknown as { loxodromeSnapshotCaches?: Caches };

function caches(): Caches {
  // A table of 60,000 samples is about 5 MB; a snapshot about 100 kB.
  g.loxodromeSnapshotCaches ??= { tables: new Lru(8), snapshots: new Lru(256), counts: { tablesBuilt: 0, snapshotsBuilt: 0 } };
  return g.loxodromeSnapshotCaches;
}

/** How many tables and snapshots this process has computed (tests check the caches work). */
export function snapshotCacheCounts(): { tablesBuilt: number; snapshotsBuilt: number } {
  return { ...caches().counts };
}

/** The simulated capture of a scenario (deterministic: the same spec gives the same numbers). */
export function scenarioTable(spec: ScenarioSpec, specKey = canonicalJson(spec)): ColumnTable {
  const c = caches();
  let table = c.tables.get(specKey);
  if (!table) {
    table = simulateCapture(scenarioCaptureSpec(spec)).table;
    c.tables.set(specKey, table);
    c.counts.tablesBuilt += 1;
  }
  return table;
}

/**
 * The live snapshot of a scenario's capture at `position` samples, as JSON text (typed arrays
 * as arrays, non-finite numbers as null), computed once per process for each spec and position.
 */
export function liveSnapshotJson(spec: ScenarioSpec, position: number, specKey = canonicalJson(spec)): string {
  const c = caches();
  const key = `${position}@${specKey}`;
  let json = c.snapshots.get(key);
  if (json === undefined) {
    const table = scenarioTable(spec, specKey);
    const snapshot = liveSnapshot(table, position, {
      units: SCENARIO_UNITS,
      site: { latitudeDeg: spec.site.latitudeDeg, longitudeDeg: spec.site.longitudeDeg, altitudeM: spec.site.altitudeM },
      date: captureDateAtNoonUtc(spec.date),
      magnetometerRangesUt: scenarioMagnetometerRanges(spec),
    });
    json = JSON.stringify(toJsonSafe(snapshot));
    c.snapshots.set(key, json);
    c.counts.snapshotsBuilt += 1;
  }
  return json;
}
