import { describe, expect, test } from "vitest";
import { ACTIONS, allowedActions, assignableRoles, can, type Action } from "@/lib/permissions";
import { ROLES, type Role } from "@/lib/roles";

/**
 * The role matrix as documented in the README ("Roles"), written out by hand so that a change
 * in lib/permissions.ts that the README does not also describe fails here.
 */
const DOCUMENTED: Record<Action, Role[]> = {
  "workspace.view": ["owner", "technician", "builder", "instructor", "student"],
  "workspace.update": ["owner"],
  "member.list": ["owner", "technician", "builder", "instructor"],
  "member.invite": ["owner"],
  "member.change-role": ["owner"],
  "member.remove": ["owner"],
  "audit.view": ["owner", "technician"],
  "vehicle.view": ["owner", "technician", "builder", "instructor"],
  "vehicle.edit": ["owner", "technician", "builder"],
  "site.edit": ["owner", "technician", "builder"],
  "run.view": ["owner", "technician", "builder", "instructor", "student"],
  "run.create": ["owner", "technician", "builder"],
  "run.edit": ["owner", "technician", "builder"],
  "run.sign-off": ["owner", "technician"],
  "class.view": ["owner", "technician", "instructor", "student"],
  "class.host": ["owner", "instructor"],
  "class.join": ["owner", "technician", "builder", "instructor", "student"],
  "scenario.manage": ["owner", "instructor"],
  "demo.manage": ["owner", "instructor"],
  "shared.view": ["owner", "technician", "builder", "instructor", "student"],
};

describe("can", () => {
  const rows = ROLES.flatMap((role) => ACTIONS.map((action) => [role, action, DOCUMENTED[action].includes(role)] as const));
  test.each(rows)("%s may %s: %s (without a resource)", (role, action, expected) => {
    expect(can(role, action, "someone")).toBe(expected);
  });

  test.each([
    ["builder edits a run they uploaded", "builder", "run.edit", { createdById: "me" }, true],
    ["builder edits someone else's run", "builder", "run.edit", { createdById: "other" }, false],
    ["builder edits someone else's vehicle", "builder", "vehicle.edit", { createdById: "other" }, false],
    ["technician edits someone else's run", "technician", "run.edit", { createdById: "other" }, true],
    ["student reads a run shared with students", "student", "run.view", { sharedWithStudents: true }, true],
    ["student reads a run not shared", "student", "run.view", { sharedWithStudents: false }, false],
  ] as const)("%s", (_label, role, action, resource, expected) => {
    expect(can(role, action, "me", resource)).toBe(expected);
  });
});

describe("allowedActions", () => {
  test.each(ROLES)("%s: the documented list, nothing more", (role) => {
    const expected = ACTIONS.filter((a) => DOCUMENTED[a].includes(role));
    expect(allowedActions(role)).toEqual(expected);
  });
});

describe("assignableRoles", () => {
  test("only owners hand out roles, and any role", () => {
    expect(assignableRoles("owner")).toEqual([...ROLES]);
    for (const role of ROLES.filter((r) => r !== "owner")) expect(assignableRoles(role)).toEqual([]);
  });
});
