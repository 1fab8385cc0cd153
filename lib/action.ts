import "server-only";
import { unstable_rethrow } from "next/navigation";
import { z } from "zod";
import { getWorkspaceAccess } from "@/lib/data/workspaces";
import { contextFor, getViewer, type WorkspaceContext } from "@/lib/guard";
import type { Action } from "@/lib/permissions";
import type { UserSummary } from "@/lib/data/users";
import type { ActionState } from "@/lib/action-state";
import { UserFacingError } from "@/lib/errors";

export { idle, type ActionState } from "@/lib/action-state";

export { UserFacingError };

const SECRET_FIELDS = /password|confirm|token/i;

function formValues(formData: FormData): Record<string, string> {
  const values: Record<string, string> = {};
  for (const [key, value] of formData.entries()) {
    if (typeof value === "string" && !key.startsWith("$") && !SECRET_FIELDS.test(key)) values[key] = value;
  }
  return values;
}

function parse<S extends z.ZodType>(schema: S, formData: FormData): { ok: true; data: z.infer<S> } | { ok: false; state: ActionState } {
  const raw: Record<string, unknown> = {};
  for (const [key, value] of formData.entries()) if (!key.startsWith("$")) raw[key] = value;
  const result = schema.safeParse(raw);
  if (result.success) return { ok: true, data: result.data };
  const fieldErrors: Record<string, string> = {};
  for (const issue of result.error.issues) {
    const field = issue.path.join(".") || "form";
    fieldErrors[field] ??= issue.message;
  }
  return {
    ok: false,
    state: { status: "error", code: "invalid", message: "Some fields need attention.", fieldErrors, values: formValues(formData) },
  };
}

async function run(formData: FormData, work: () => Promise<ActionState | void>): Promise<ActionState> {
  try {
    return (await work()) ?? { status: "ok" };
  } catch (error) {
    unstable_rethrow(error); // redirect(), notFound() and friends are control flow, not failures.
    if (error instanceof UserFacingError) {
      return {
        status: "error",
        code: "failed",
        message: error.message,
        fieldErrors: error.field ? { [error.field]: error.message } : undefined,
        values: formValues(formData),
      };
    }
    console.error("[action] unexpected error", error);
    return {
      status: "error",
      code: "failed",
      message: "Something went wrong on our side. Try again in a moment.",
      values: formValues(formData),
    };
  }
}

type Handler<S extends z.ZodType, C> = (context: C, input: z.infer<S>, formData: FormData) => Promise<ActionState | void>;

/** An action anyone may call (sign in, sign up, password reset). Input validated with zod. */
export function publicAction<S extends z.ZodType>(schema: S, handler: Handler<S, null>) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    const parsed = parse(schema, formData);
    if (!parsed.ok) return parsed.state;
    return run(formData, () => handler(null, parsed.data, formData));
  };
}

/** An action for any signed-in user, outside a workspace (create a workspace, accept an invitation). */
export function userAction<S extends z.ZodType>(schema: S, handler: Handler<S, { viewer: UserSummary }>) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    const viewer = await getViewer();
    if (!viewer) return { status: "error", code: "unauthenticated", message: "Your session has ended. Sign in again." };
    const parsed = parse(schema, formData);
    if (!parsed.ok) return parsed.state;
    return run(formData, () => handler({ viewer }, parsed.data, formData));
  };
}

/**
 * An action inside one workspace. The form carries the workspace slug in a hidden
 * `workspace` field; membership and `permission` are checked before the input is even parsed.
 */
export function workspaceAction<S extends z.ZodType>(permission: Action, schema: S, handler: Handler<S, WorkspaceContext>) {
  return async (_previous: ActionState, formData: FormData): Promise<ActionState> => {
    const viewer = await getViewer();
    if (!viewer) return { status: "error", code: "unauthenticated", message: "Your session has ended. Sign in again." };
    const slug = formData.get("workspace");
    const access = typeof slug === "string" ? await getWorkspaceAccess(viewer.id, slug) : null;
    if (!access) return { status: "error", code: "not-found", message: "That workspace was not found." };
    const context = contextFor(viewer, access);
    if (!context.can(permission)) {
      return { status: "error", code: "forbidden", message: "Your role in this workspace does not allow this." };
    }
    const parsed = parse(schema, formData);
    if (!parsed.ok) return parsed.state;
    return run(formData, () => handler(context, parsed.data, formData));
  };
}
