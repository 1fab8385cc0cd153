/**
 * What every server action returns to its form. Errors carry a code so that callers (and
 * tests) can tell "not signed in" from "not yours" from "not allowed" from "bad input".
 */
export type ActionState =
  | { status: "idle" }
  | { status: "ok"; message?: string; data?: Record<string, unknown> }
  | {
      status: "error";
      code: "unauthenticated" | "not-found" | "forbidden" | "invalid" | "failed";
      message: string;
      fieldErrors?: Record<string, string>;
      values?: Record<string, string>;
    };

export const idle: ActionState = { status: "idle" };
