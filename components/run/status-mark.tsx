import type { CheckStatus } from "@/geometry/types";

/**
 * Each status as a word, a shape and a colour, never colour alone. The shapes match the run
 * list's verdict badge: a full disc for pass, a half-filled disc for warn, a ring struck
 * through for fail; a dotted ring for a check that could not be made.
 */
export const STATUS_LOOK: Record<CheckStatus, { word: string; text: string; chip: string; rule: string }> = {
  pass: {
    word: "Pass",
    text: "text-steady dark:text-emerald-300",
    // The word is a shade darker than the status colour so small text keeps 4.5:1 on the soft background.
    chip: "border-steady/40 bg-steady-soft text-steady-ink dark:text-emerald-300",
    rule: "border-l-steady",
  },
  warn: {
    word: "Warn",
    text: "text-heed dark:text-amber-300",
    chip: "border-heed/40 bg-heed-soft text-heed-ink dark:text-amber-300",
    rule: "border-l-heed",
  },
  fail: {
    word: "Fail",
    text: "text-halt dark:text-red-300",
    chip: "border-halt/40 bg-halt-soft text-halt dark:text-red-300",
    rule: "border-l-halt",
  },
  skipped: {
    word: "Not checked",
    text: "text-chart-muted",
    chip: "border-chart-rule bg-chart-paper text-chart-muted",
    rule: "border-l-chart-rule",
  },
};

/** The shape alone (hidden from screen readers: the word beside it says the same). */
export function StatusShape({ status, className = "h-3 w-3" }: { status: CheckStatus; className?: string }) {
  return (
    <svg viewBox="0 0 12 12" className={`shrink-0 ${className}`} aria-hidden focusable="false">
      {status === "pass" ? <circle cx="6" cy="6" r="5" fill="currentColor" /> : null}
      {status === "warn" ? (
        <>
          <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <path d="M6 1.5 A4.5 4.5 0 0 0 6 10.5 Z" fill="currentColor" />
        </>
      ) : null}
      {status === "fail" ? (
        <>
          <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <path d="M2.8 9.2 L9.2 2.8" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" />
        </>
      ) : null}
      {status === "skipped" ? (
        <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.5" strokeDasharray="1.6 1.9" />
      ) : null}
    </svg>
  );
}

/** A status chip: shape and word on the status's soft colour. */
export function StatusChip({ status }: { status: CheckStatus }) {
  const look = STATUS_LOOK[status];
  return (
    <span
      className={`inline-flex shrink-0 items-center gap-1.5 rounded-full border px-2 py-0.5 text-xs font-semibold print:border-chart-ink print:bg-transparent print:text-chart-ink ${look.chip}`}
      data-status={status}
    >
      <StatusShape status={status} />
      {look.word}
    </span>
  );
}
