import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, test } from "vitest";
import { VerdictBanner } from "@/components/run/verdict-banner";
import { VEHICLE_KINDS, type VehicleKind } from "@/lib/fleet-terms";
import { doNotGoOutWords } from "@/lib/vehicle-words";

const headline = (verdict: "pass" | "warn" | "fail", vehicleKind?: VehicleKind | null) =>
  renderToStaticMarkup(createElement(VerdictBanner, { verdict, verdictSummary: "Summary.", diagnosis: [], vehicleKind })).match(
    /<h2 id="verdict-heading"[^>]*>([^<]*)<\/h2>/,
  )?.[1];

// The words are our own: each kind of vehicle is told what not to do with it.
describe("VerdictBanner: a failure is worded for the kind of vehicle", () => {
  test.each([
    { label: "multirotor", kind: "multirotor", words: "Do not fly on this calibration" },
    { label: "fixed-wing", kind: "fixed-wing", words: "Do not fly on this calibration" },
    { label: "vtol", kind: "vtol", words: "Do not fly on this calibration" },
    { label: "rover", kind: "rover", words: "Do not drive on this calibration" },
    { label: "boat", kind: "boat", words: "Do not sail on this calibration" },
    { label: "other", kind: "other", words: "Do not operate the vehicle on this calibration" },
    { label: "unknown", kind: null, words: "Do not operate the vehicle on this calibration" },
  ] as { label: string; kind: VehicleKind | null; words: string }[])("$label", ({ kind, words }) => {
    expect(headline("fail", kind)).toBe(words);
    expect(doNotGoOutWords(kind)).toBe(words);
  });

  test("every kind has words, and a pass or a warning reads the same for all", () => {
    for (const kind of VEHICLE_KINDS) {
      expect(doNotGoOutWords(kind)).toMatch(/^Do not \w.* on this calibration$/);
      expect(headline("pass", kind)).toBe("This calibration can be used");
      expect(headline("warn", kind)).toBe("Usable only after reading the warnings");
    }
  });
});
