import type { Role } from "@/lib/roles";

/**
 * Every decision about who may do what in a workspace is made here, and only here.
 * Pages, route handlers and server actions ask `can()` through the shared guards in
 * lib/guard.ts, on the server. Being a member of the workspace is checked before this:
 * a non-member learns nothing, not even that the workspace exists.
 */
export const ACTIONS = [
  "workspace.view",
  "workspace.update",
  "member.list",
  "member.invite",
  "member.change-role",
  "member.remove",
  "audit.view",
  "vehicle.view",
  "vehicle.edit",
  "site.edit",
  "run.view",
  "run.create",
  "run.edit",
  "run.sign-off",
  "class.view",
  "class.host",
  "class.join",
  "scenario.manage",
  "demo.manage",
  "shared.view",
] as const;
export type Action = (typeof ACTIONS)[number];

/** Resource facts that some rules depend on, e.g. who uploaded a run. */
export interface ResourceContext {
  createdById?: string | null;
  sharedWithStudents?: boolean;
}

type Rule = boolean | ((actorId: string, resource?: ResourceContext) => boolean);

const createdBySelf: Rule = (actorId, resource) => resource === undefined || resource.createdById === actorId;
const sharedOnly: Rule = (_actorId, resource) => resource === undefined || resource.sharedWithStudents === true;

/** The matrix, documented in the README ("Roles"). Missing entries mean "no". */
const MATRIX: Record<Role, Partial<Record<Action, Rule>>> = {
  // Owners may do everything.
  owner: Object.fromEntries(ACTIONS.map((action) => [action, true])),
  technician: {
    "workspace.view": true,
    "member.list": true,
    "audit.view": true,
    "vehicle.view": true,
    "vehicle.edit": true,
    "site.edit": true,
    "run.view": true,
    "run.create": true,
    "run.edit": true,
    "run.sign-off": true,
    "class.view": true,
    "class.join": true,
    "shared.view": true,
  },
  builder: {
    "workspace.view": true,
    "member.list": true,
    "vehicle.view": true,
    "vehicle.edit": createdBySelf,
    "site.edit": true,
    "run.view": true,
    "run.create": true,
    "run.edit": createdBySelf,
    "class.join": true,
    "shared.view": true,
  },
  instructor: {
    "workspace.view": true,
    "member.list": true,
    "vehicle.view": true,
    "run.view": true,
    "class.view": true,
    "class.host": true,
    "class.join": true,
    "scenario.manage": true,
    "demo.manage": true,
    "shared.view": true,
  },
  student: {
    "workspace.view": true,
    "class.view": true,
    "class.join": true,
    "shared.view": sharedOnly,
    "run.view": sharedOnly,
  },
};

/** May a member with `role` do `action` (on `resource`, when the rule depends on it)? */
export function can(role: Role, action: Action, actorId = "", resource?: ResourceContext): boolean {
  const rule = MATRIX[role]?.[action];
  if (rule === undefined || rule === false) return false;
  if (rule === true) return true;
  return rule(actorId, resource);
}

/** Every action a role may take at all (ignoring per-resource rules); used to shape navigation. */
export function allowedActions(role: Role): Action[] {
  return ACTIONS.filter((action) => MATRIX[role]?.[action] !== undefined && MATRIX[role]?.[action] !== false);
}

/** Roles an inviter may hand out: only owners invite, and they may give any role. */
export function assignableRoles(role: Role): Role[] {
  return role === "owner" ? ["owner", "technician", "builder", "instructor", "student"] : [];
}
