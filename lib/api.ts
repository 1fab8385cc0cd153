import "server-only";
import { NextResponse } from "next/server";
import { z } from "zod";
import { userForApiToken } from "@/lib/data/api-tokens";
import { getWorkspaceAccess } from "@/lib/data/workspaces";
import { contextFor, getViewer, type WorkspaceContext } from "@/lib/guard";
import type { Action } from "@/lib/permissions";
import type { UserSummary } from "@/lib/data/users";
import { InvalidFieldError, UserFacingError } from "@/lib/errors";
import { isRecordId } from "@/lib/ids";

export function jsonError(status: number, error: string, message: string, extra?: Record<string, unknown>) {
  return NextResponse.json({ error, message, ...extra }, { status });
}

/** Validate a JSON body; the error names each offending field. */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
): Promise<{ ok: true; data: z.infer<S> } | { ok: false; response: Response }> {
  let body: unknown;
  try {
    body = await request.json();
  } catch {
    return { ok: false, response: jsonError(400, "invalid", "The request body is not valid JSON.") };
  }
  const result = schema.safeParse(body);
  if (result.success) return { ok: true, data: result.data };
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) fields[issue.path.join(".") || "body"] ??= issue.message;
  return { ok: false, response: jsonError(400, "invalid", "Some fields need attention.", { fields }) };
}

/** Validate the query string; the error names each offending parameter. */
export function readQuery<S extends z.ZodType>(
  request: Request,
  schema: S,
): { ok: true; data: z.infer<S> } | { ok: false; response: Response } {
  const params = Object.fromEntries(new URL(request.url).searchParams.entries());
  const result = schema.safeParse(params);
  if (result.success) return { ok: true, data: result.data };
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) fields[issue.path.join(".") || "query"] ??= issue.message;
  return { ok: false, response: jsonError(400, "invalid", "Some query parameters need attention.", { fields }) };
}

export const notFound = () => jsonError(404, "not-found", "Not found.");
export const forbidden = () => jsonError(403, "forbidden", "Your role in this workspace does not allow this.");

async function guarded(work: () => Promise<Response>): Promise<Response> {
  try {
    return await work();
  } catch (error) {
    if (error instanceof InvalidFieldError)
      return jsonError(400, "invalid", "Some fields need attention.", { fields: { [error.field]: error.message } });
    if (error instanceof UserFacingError)
      return jsonError(409, "conflict", error.message, error.field ? { fields: { [error.field]: error.message } } : undefined);
    console.error("[api] unexpected error", error);
    return jsonError(500, "internal", "Something went wrong on our side.");
  }
}

type Params<P> = { params: Promise<P> };

/**
 * Who is calling: a personal API token (`Authorization: Bearer lox_…`) when one is sent —
 * and then only that, so a bad token is never rescued by a cookie — else the session cookie.
 */
async function callerOf(request: Request): Promise<UserSummary | null> {
  const authorization = request.headers.get("authorization");
  if (authorization) {
    const match = /^Bearer\s+(\S+)$/i.exec(authorization);
    return match ? userForApiToken(match[1]) : null;
  }
  return getViewer();
}

/** A route handler for any signed-in user: 401 without a session. */
export function userRoute<P = Record<string, never>>(handler: (request: Request, viewer: UserSummary, params: P) => Promise<Response>) {
  return async (request: Request, { params }: Params<P>) =>
    guarded(async () => {
      const viewer = await callerOf(request);
      if (!viewer) return jsonError(401, "unauthenticated", "Sign in first, or send a valid API token.");
      return handler(request, viewer, await params);
    });
}

/**
 * A route handler under /api/workspaces/[slug]/…: 401 without a session, 404 for a
 * non-member (never revealing the workspace), 403 when the role lacks `permission`.
 */
export function workspaceRoute<P extends { slug: string }>(
  permission: Action,
  handler: (request: Request, context: WorkspaceContext, params: P) => Promise<Response>,
) {
  return async (request: Request, { params }: Params<P>) =>
    guarded(async () => {
      const viewer = await callerOf(request);
      if (!viewer) return jsonError(401, "unauthenticated", "Sign in first, or send a valid API token.");
      const resolved = await params;
      // Ids in the path are UUIDs; anything else cannot name a row, so it is simply not found.
      for (const [key, value] of Object.entries(resolved)) if (key.endsWith("Id") && !isRecordId(String(value))) return notFound();
      const access = await getWorkspaceAccess(viewer.id, resolved.slug);
      if (!access) return jsonError(404, "not-found", "Not found.");
      const context = contextFor(viewer, access);
      if (!context.can(permission)) return jsonError(403, "forbidden", "Your role in this workspace does not allow this.");
      return handler(request, context, resolved);
    });
}
