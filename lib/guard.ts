import "server-only";
import { cache } from "react";
import { headers } from "next/headers";
import { forbidden, notFound, redirect } from "next/navigation";
import { getUserById, type UserSummary } from "@/lib/data/users";
import { getWorkspaceAccess, type WorkspaceAccess } from "@/lib/data/workspaces";
import { can, type Action, type ResourceContext } from "@/lib/permissions";
import { getSession } from "@/lib/session";

/** The signed-in user of this request, or null. Cached for the request. */
export const getViewer = cache(async (): Promise<UserSummary | null> => {
  const session = await getSession();
  if (!session.userId) return null;
  const user = await getUserById(session.userId);
  // A session for a deleted account is as good as none.
  return user;
});

/** The client's address as seen by the server, for rate limits and the audit trail. */
export async function clientAddress(): Promise<string> {
  const h = await headers();
  return h.get("x-forwarded-for")?.split(",")[0]?.trim() || h.get("x-real-ip") || "local";
}

/** For pages: the signed-in user, or a redirect to the sign-in page that comes back here. */
export async function requireViewer(returnTo?: string): Promise<UserSummary> {
  const viewer = await getViewer();
  if (!viewer) redirect(returnTo ? `/sign-in?next=${encodeURIComponent(returnTo)}` : "/sign-in");
  return viewer;
}

export interface WorkspaceContext {
  viewer: UserSummary;
  access: WorkspaceAccess;
  /** Ask the permissions module about this member, optionally for one resource. */
  can: (action: Action, resource?: ResourceContext) => boolean;
}

export function contextFor(viewer: UserSummary, access: WorkspaceAccess): WorkspaceContext {
  return { viewer, access, can: (action, resource) => can(access.role, action, viewer.id, resource) };
}

/**
 * For pages under /w/[slug]: sign-in required; a non-member gets the plain 404 (nothing
 * about the workspace leaks); a member whose role lacks `action` gets the 403 page.
 */
export async function requireWorkspacePage(slug: string, action: Action = "workspace.view"): Promise<WorkspaceContext> {
  const viewer = await requireViewer(`/w/${slug}`);
  const access = await getWorkspaceAccess(viewer.id, slug);
  if (!access) notFound();
  const context = contextFor(viewer, access);
  if (!context.can(action)) forbidden();
  return context;
}
