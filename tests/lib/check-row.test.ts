import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { CheckRow } from "@/components/run/check-row";
import { limitSourceWords } from "@/components/run/limit-source";
import { gradedCheck } from "@/geometry/checks-common";
import { resolveThresholds, THRESHOLDS, type ThresholdId, type ThresholdOverrides } from "@/geometry/thresholds";
import type { Check } from "@/geometry/types";

/** A check graded against the table (with a workspace's overrides, if any). */
function graded(id: ThresholdId, measured: number, overrides: ThresholdOverrides = {}): Check {
  return gradedCheck(resolveThresholds(overrides), {
    id,
    title: "A check",
    sensor: "compass_a",
    measured,
    explain: () => ({ explanation: "Measured.", remedy: null }),
  });
}

/** The limit-source line of a rendered row, as text. */
function limitLine(check: Check): { kind: string | undefined; text: string } {
  const html = renderToStaticMarkup(createElement(CheckRow, { check }));
  const match = html.match(/<p[^>]*data-testid="limit-source" data-source-kind="(\w+)"[^>]*>([\s\S]*?)<\/p>/);
  const text = (match?.[2] ?? "")
    .replace(/&#x27;/g, "'")
    .replace(/&quot;/g, '"')
    .replace(/&amp;/g, "&");
  return { kind: match?.[1], text };
}

// Limits, sources and reasoning are the threshold table's own (geometry/thresholds.ts).
describe("CheckRow: where the limit comes from", () => {
  test.each([
    {
      label: "from memory: said plainly, with the table's reasoning",
      check: graded("gyro.bias", 1),
      kind: "typical",
      text: `Typical value, no published source. MEMS zero-rate offsets are specified to roughly ±1–5 °/s.`,
    },
    {
      label: "from memory, a result saved before checks carried the reasoning",
      check: { ...graded("accel.scale", 1), basis: undefined },
      kind: "typical",
      text: `Typical value, no published source. ${THRESHOLDS["accel.scale"].basis}.`,
    },
    {
      label: "common practice, with the table's reasoning",
      check: graded("mag.residual", 1),
      kind: "practice",
      text: "Common practice. Sensor noise and a sound fit leave well under 1%; more means disturbance during the capture or a model too simple.",
    },
    {
      label: "common practice with a note, then the reasoning",
      check: graded("mag.coverage", 90),
      kind: "practice",
      text: `Common practice, checked against simulated captures: a minute's full tumble fills every cell (3 samples each), the upper half of the sphere about half, turning about one axis under a quarter. Where half the directions were never visited the fit can trade offset against soft iron along the missing ones.`,
    },
    {
      label: "common practice on a check without a limit",
      check: { ...graded("mag.residual", 1), id: "mag.fit", threshold: null, unit: null, basis: undefined } as Check,
      kind: "practice",
      text: "Common practice.",
    },
    {
      label: "a publication: named as it stands",
      check: graded("mag.field-plausible", 49),
      kind: "publication",
      text: `Limit from: ${THRESHOLDS["mag.field-plausible"].source}`,
    },
    {
      label: "set by the workspace over a remembered default",
      check: graded("accel.offset", 0.1, { "accel.offset": { warnAbove: 1 } }),
      kind: "workspace",
      text: "Set by the workspace (default warn above 0.6, fail above 1.5 m/s²; typical value, no published source).",
    },
  ])("$label", ({ check, kind, text }) => {
    const line = limitLine(check);
    expect(line.kind).toBe(kind);
    expect(line.text).toBe(text);
    expect(line.text).not.toMatch(/from memory/);
    expect(line.text).not.toContain("..");
  });

  test("every threshold in the table gets words without 'from memory'", () => {
    for (const id of Object.keys(THRESHOLDS) as ThresholdId[]) {
      const words = limitSourceWords(graded(id, 0));
      expect(words.text, id).not.toMatch(/from memory/);
      if (THRESHOLDS[id].source === "from memory") expect(words.kind, id).toBe("typical");
    }
  });
});
