import type { ReactNode } from "react";

/** What a list shows when it has nothing: what is missing, and what to do about it. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="px-6 py-12 text-center" data-testid="empty-state">
      <p className="font-display text-lg font-semibold">{title}</p>
      {children ? <div className="mx-auto mt-1 max-w-prose text-sm text-chart-muted">{children}</div> : null}
      {action ? <div className="mt-4 flex justify-center">{action}</div> : null}
    </div>
  );
}
