import "server-only";
import type { WorkspaceContext } from "@/lib/guard";
import type { Action } from "@/lib/permissions";
import { runOwnership } from "@/lib/data/runs";

/**
 * Whether this member may take `action` on one run: "missing" when the run is not in the
 * workspace or — for a student — not shared with students (both look the same from outside).
 */
export async function runAccess(context: WorkspaceContext, runId: string, action: Action): Promise<"ok" | "missing" | "forbidden"> {
  const ownership = await runOwnership(context.access.workspace.id, runId);
  if (!ownership) return "missing";
  if (!context.can("run.view", ownership)) return "missing";
  return context.can(action, ownership) ? "ok" : "forbidden";
}
