import type { Verdict } from "@/lib/fleet-terms";

const LOOK: Record<Verdict, { word: string; tone: string }> = {
  pass: { word: "Pass", tone: "border-steady/40 bg-steady-soft text-steady-ink dark:text-emerald-300" },
  warn: { word: "Warn", tone: "border-heed/40 bg-heed-soft text-heed-ink dark:text-amber-300" },
  fail: { word: "Fail", tone: "border-halt/40 bg-halt-soft text-halt dark:text-red-300" },
};

/**
 * The mark beside each verdict word, so the verdict never rests on colour alone: a full disc
 * for pass, a half-filled disc for warn, an empty ring struck through for fail.
 */
function VerdictMark({ verdict }: { verdict: Verdict }) {
  return (
    <svg viewBox="0 0 12 12" className="h-3 w-3 shrink-0" aria-hidden>
      {verdict === "pass" ? <circle cx="6" cy="6" r="5" fill="currentColor" /> : null}
      {verdict === "warn" ? (
        <>
          <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <path d="M6 1.5 A4.5 4.5 0 0 0 6 10.5 Z" fill="currentColor" />
        </>
      ) : null}
      {verdict === "fail" ? (
        <>
          <circle cx="6" cy="6" r="4.5" fill="none" stroke="currentColor" strokeWidth="1.5" />
          <path d="M2.8 9.2 L9.2 2.8" stroke="currentColor" strokeWidth="1.5" strokeLinecap="round" />
        </>
      ) : null}
    </svg>
  );
}

export function isVerdict(value: string | null | undefined): value is Verdict {
  return value === "pass" || value === "warn" || value === "fail";
}

/** A run's verdict as a word, a mark and a colour; a dash when there is none yet. */
export function VerdictBadge({ verdict }: { verdict: string | null | undefined }) {
  if (!isVerdict(verdict)) {
    return (
      <span className="text-chart-muted">
        <span aria-hidden>—</span>
        <span className="sr-only">No verdict yet</span>
      </span>
    );
  }
  const look = LOOK[verdict];
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-full border px-2 py-0.5 text-xs font-semibold ${look.tone}`}
      data-verdict={verdict}
    >
      <VerdictMark verdict={verdict} />
      {look.word}
    </span>
  );
}

export const VERDICT_WORDS: Record<Verdict, string> = { pass: LOOK.pass.word, warn: LOOK.warn.word, fail: LOOK.fail.word };
