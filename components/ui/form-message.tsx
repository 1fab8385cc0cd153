import type { ActionState } from "@/lib/action-state";

/** The form-level outcome of an action: a success note or an error summary. */
export function FormMessage({ state }: { state: ActionState }) {
  if (state.status === "ok" && state.message) {
    return (
      <p role="status" className="rounded-lg border border-steady/30 bg-steady-soft px-3 py-2 text-sm">
        {state.message}
      </p>
    );
  }
  if (state.status === "error") {
    return (
      <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
        {state.message}
      </p>
    );
  }
  return null;
}

export function fieldError(state: ActionState, field: string): string | undefined {
  return state.status === "error" ? state.fieldErrors?.[field] : undefined;
}

export function fieldValue(state: ActionState, field: string, fallback = ""): string {
  return state.status === "error" ? (state.values?.[field] ?? fallback) : fallback;
}
