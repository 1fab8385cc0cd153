import { streamStatusWords, type StreamStatus } from "./stream-rules";

/**
 * How the page's live connection stands, as a word and a shape: a filled dot when live, a
 * spinning ring while reconnecting, an empty ring when stopped. Announced politely.
 */
export function ConnectionBadge({ status, attempt, ended = false }: { status: StreamStatus; attempt: number; ended?: boolean }) {
  const words = ended ? "Session over" : streamStatusWords(status, attempt);
  const tone =
    ended || status === "stopped"
      ? "border-chart-rule text-chart-muted"
      : status === "live"
        ? "border-steady/40 bg-steady-soft text-steady-ink dark:text-emerald-300"
        : "border-heed/40 bg-heed-soft text-heed-ink dark:text-amber-300";
  return (
    <span
      className={`inline-flex items-center gap-1.5 rounded-full border px-2.5 py-0.5 text-xs font-semibold ${tone}`}
      role="status"
      aria-live="polite"
      data-testid="connection"
      data-status={ended ? "ended" : status}
    >
      <svg
        viewBox="0 0 10 10"
        className={`h-2.5 w-2.5 shrink-0 ${status === "reconnecting" || status === "connecting" ? "animate-spin" : ""}`}
        aria-hidden
      >
        {status === "live" && !ended ? <circle cx="5" cy="5" r="4" fill="currentColor" /> : null}
        {(status === "reconnecting" || status === "connecting") && !ended ? (
          <path d="M5 1a4 4 0 1 1-4 4" fill="none" stroke="currentColor" strokeWidth="1.6" strokeLinecap="round" />
        ) : null}
        {status === "stopped" || ended ? <circle cx="5" cy="5" r="3.3" fill="none" stroke="currentColor" strokeWidth="1.4" /> : null}
      </svg>
      {words}
    </span>
  );
}
