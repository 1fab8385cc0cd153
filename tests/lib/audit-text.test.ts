import { describe, expect, test } from "vitest";
import { describeAuditEvent } from "@/components/workspace/audit-text";
import type { AuditEntry } from "@/lib/data/audit-events";

const entry = (action: string, detail: Record<string, unknown>, actorName: string | null = "Ines"): AuditEntry => ({
  id: "1",
  action,
  actorName,
  targetType: null,
  targetId: null,
  detail,
  createdAt: "2026-12-01T10:00:00.000Z",
});

describe("describeAuditEvent", () => {
  test.each([
    ["an invitation", entry("member.invited", { email: "a@b.example", role: "builder" }), "Ines invited a@b.example as builder"],
    [
      "a changed declaration",
      entry("sensor.updated", { label: "mast", mountingFrom: "x-forward.z-down", mountingTo: "x-right.z-down" }),
      "Ines changed the declared mounting of “mast”: was x → forward, z → down; now x → right, z → down",
    ],
    [
      "a changed declaration from a value that is none of the 48",
      entry("sensor.updated", { label: "mast", mountingFrom: "sideways", mountingTo: "x-forward.z-up" }),
      "Ines changed the declared mounting of “mast”: was sideways; now x → forward, z → up",
    ],
    ["a plain sensor edit", entry("sensor.updated", { label: "mast" }), "Ines edited the sensor “mast”"],
    ["a sign-off", entry("run.signed-off", { file: "h1.csv", version: 2, verdict: "pass" }), "Ines signed off h1.csv, version 2 (pass)"],
    ["the seeded start", entry("workspace.created", { seeded: true }, null), "Demo workspace prepared"],
    ["an unknown kind", entry("something.new", {}), "Ines: something.new"],
  ])("%s", (_label, event, text) => {
    expect(describeAuditEvent(event)).toBe(text);
  });
});
