/**
 * Reads data stored before Loxodrome named sensors and mountings in its own words, and
 * rewrites it in them. Until 2026-12 a capture's sensors were numbered from zero with short
 * stems and a mounting was a list of turns; both are retired. This module is the one place
 * that still knows the retired spellings: the data migration applies it to the database, and
 * the run-view reader applies it to drawing data already kept in object storage.
 *
 * Pure: no database or storage access, so it runs in a migration and in a unit test alike.
 */
import { mountingRotationById, nearestMountingRotation } from "@/geometry/mounting-rotations";
import { slotName, slotWords, type SensorFamily } from "@/geometry/sensor-slots";
import { rotationX, rotationY, rotationZ } from "@/geometry/rotation";
import type { Mat3 } from "@/geometry/types";
import { mulMat } from "@/geometry/vector";

const RETIRED_STEM: Record<string, SensorFamily> = { mag: "mag", accel: "accel", gyro: "gyro" };
const RETIRED_SLOT = /^(mag|accel|gyro)(\d)$/;
const RETIRED_FIELD = /^(mag|accel|gyro)(\d)\.([xyz])$/;
const RETIRED_SLOT_IN_TEXT = /\b(mag|accel|gyro)(\d)\b/g;
const RETIRED_EVIDENCE = /@(mag|accel|gyro)(\d)\b/g;
/** A retired mounting name: "none", or turns about fixed axes in order, "roll 180 yaw 45". */
const RETIRED_MOUNTING = /^(?:none|(?:roll|pitch|yaw) \d{1,3}(?: (?:pitch|yaw) \d{1,3}){0,2})$/;
const RETIRED_MOUNTING_IN_TEXT = /(["(])(none|(?:roll|pitch|yaw) \d{1,3}(?: (?:pitch|yaw) \d{1,3}){0,2})([")])/g;
const RETIRED_TITLES: Record<string, string> = { "Gyroscope bias stability": "Gyroscope bias change between holds" };
/** Keys whose values are kept as written: what a file itself said, storage keys. */
const VERBATIM_KEYS = new Set(["header", "headers", "ignoredColumns", "key", "delimiter", "fileName"]);
/** Keys whose string value is a mounting. */
const MOUNTING_KEYS = new Set([
  "mountingRotation",
  "declaredRotation",
  "expectedName",
  "expectedId",
  "mounting_rotation",
  "mountingFrom",
  "mountingTo",
]);

function newSlot(stem: string, digit: string): string {
  return slotName(RETIRED_STEM[stem], Number(digit));
}

/** The slot name for a retired one ("mag1" → "compass_b"); the text itself otherwise. */
export function upgradeSlot(slot: string): string {
  const match = RETIRED_SLOT.exec(slot);
  return match ? newSlot(match[1], match[2]) : slot;
}

/** The field name for a retired one ("mag1.x" → "compass_b.x"); the text itself otherwise. */
export function upgradeField(field: string): string {
  const match = RETIRED_FIELD.exec(field);
  return match ? `${newSlot(match[1], match[2])}.${match[3]}` : field;
}

function retiredMountingMatrix(name: string): Mat3 {
  let matrix: Mat3 = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  // The retired names applied roll, then pitch, then yaw about the board's fixed axes.
  for (const [, axis, degrees] of name.matchAll(/(roll|pitch|yaw) (\d+)/g)) {
    const turn = axis === "roll" ? rotationX(Number(degrees)) : axis === "pitch" ? rotationY(Number(degrees)) : rotationZ(Number(degrees));
    matrix = mulMat(turn, matrix);
  }
  return matrix;
}

/** The mounting id for a retired mounting name ("yaw 90" → "x-right.z-down"), or null when it is not one. */
export function upgradeMountingName(name: string): string | null {
  if (!RETIRED_MOUNTING.test(name)) return null;
  const { nearest, residualDeg } = nearestMountingRotation(retiredMountingMatrix(name));
  return residualDeg < 0.01 ? nearest.id : null;
}

function mountingWords(name: string): string {
  const id = upgradeMountingName(name);
  return id ? (mountingRotationById(id)?.words ?? name) : name;
}

/** Prose written with retired names, rewritten: slots in words, mountings in words, retired titles. */
export function upgradeText(text: string): string {
  if (RETIRED_TITLES[text]) return RETIRED_TITLES[text];
  let out = text.replace(RETIRED_EVIDENCE, (_, stem: string, digit: string) => `@${newSlot(stem, digit)}`);
  out = out.replace(RETIRED_SLOT_IN_TEXT, (_, stem: string, digit: string) => slotWords(newSlot(stem, digit)));
  out = out.replace(RETIRED_MOUNTING_IN_TEXT, (whole, open: string, name: string, close: string) => {
    const words = mountingWords(name);
    return words === name ? whole : `${open}${words}${close}`;
  });
  for (const [old, renamed] of Object.entries(RETIRED_TITLES)) out = out.split(old).join(renamed);
  return out;
}

function upgradeString(value: string, key: string | null): string {
  if (key !== null && MOUNTING_KEYS.has(key)) {
    const id = upgradeMountingName(value);
    if (id) return id;
  }
  if (RETIRED_SLOT.test(value)) return upgradeSlot(value);
  if (RETIRED_FIELD.test(value)) return upgradeField(value);
  return upgradeText(value);
}

function isRetiredMountingObject(value: Record<string, unknown>): value is { name: string; matrix: Mat3 } {
  return typeof value.name === "string" && Array.isArray(value.matrix) && RETIRED_MOUNTING.test(value.name) && !("id" in value);
}

/**
 * A copy of any stored JSON value with every retired name rewritten: slot and field names as
 * keys or values, mounting names where a mounting is stored (and mounting objects rebuilt from
 * their matrix), and retired spellings in prose. Values without retired names come back equal.
 */
export function upgradeLegacyNames(value: unknown, key: string | null = null): unknown {
  if (key !== null && VERBATIM_KEYS.has(key)) return value;
  if (typeof value === "string") return upgradeString(value, key);
  if (Array.isArray(value)) return value.map((item) => upgradeLegacyNames(item, key));
  if (value === null || typeof value !== "object") return value;
  const record = value as Record<string, unknown>;
  if (isRetiredMountingObject(record)) {
    const id = upgradeMountingName(record.name);
    const mounting = id ? mountingRotationById(id) : undefined;
    if (mounting) return { ...mounting };
  }
  const out: Record<string, unknown> = {};
  for (const [innerKey, inner] of Object.entries(record)) {
    const renamedKey = innerKey === "expectedName" ? "expectedId" : upgradeField(upgradeSlot(innerKey));
    out[renamedKey] = upgradeLegacyNames(inner, innerKey);
  }
  return out;
}

/** Cheap test on serialised JSON: could it hold a retired name? (False positives are harmless.) */
export function mayHoldLegacyNames(json: string): boolean {
  return /\b(?:mag|accel|gyro)\d\b|"(?:none|roll \d|pitch \d|yaw \d)|expectedName|bias stability/.test(json);
}
