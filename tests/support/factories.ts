import crypto from "node:crypto";
import { createUser, type UserSummary } from "@/lib/data/users";
import { createWorkspace, type WorkspaceSummary } from "@/lib/data/workspaces";
import { db } from "@/lib/db";
import type { Role } from "@/lib/roles";

/** A short random tag so tests never collide with each other or with the demo data. */
export function uniqueTag(): string {
  return crypto.randomBytes(4).toString("hex");
}

export const TEST_PASSWORD = "correct-horse-42";

export async function makeUser(label = "user"): Promise<UserSummary> {
  const tag = uniqueTag();
  return createUser({ name: `Test ${label} ${tag}`, email: `${label}-${tag}@tests.example`, password: TEST_PASSWORD });
}

export async function makeWorkspace(owner: UserSummary, label = "ws"): Promise<WorkspaceSummary> {
  const tag = uniqueTag();
  return createWorkspace(owner.id, { name: `Workspace ${label} ${tag}`, slug: `${label}-${tag}`, kind: "operator" });
}

export async function addMember(workspace: WorkspaceSummary, user: UserSummary, role: Role): Promise<void> {
  await db().models.Membership.create({ workspaceId: workspace.id, userId: user.id, role });
}

/** FormData from a plain object, the way a browser form would send it. */
export function form(values: Record<string, string>): FormData {
  const data = new FormData();
  for (const [key, value] of Object.entries(values)) data.set(key, value);
  return data;
}
