import { useId } from "react";

/** A labelled bar from 0 to 1, announced to assistive technology as a progressbar. */
export function ProgressBar({
  label,
  fraction,
  detail,
  tone = "lox",
  testId,
}: {
  label: string;
  fraction: number;
  detail?: string;
  tone?: "lox" | "halt";
  testId?: string;
}) {
  const id = useId();
  const percent = Math.round(Math.min(Math.max(fraction, 0), 1) * 100);
  return (
    <div className="space-y-1.5">
      <div className="flex items-baseline justify-between gap-4 text-sm">
        <span id={id} className="font-medium">
          {label}
        </span>
        <span className="font-mono text-xs text-chart-muted">{detail ?? `${percent}%`}</span>
      </div>
      <div
        role="progressbar"
        aria-labelledby={id}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        aria-valuetext={detail ? `${percent}%, ${detail}` : `${percent}%`}
        data-testid={testId}
        className="h-2.5 overflow-hidden rounded-full bg-chart-rule"
      >
        <div
          className={`h-full rounded-full transition-[width] duration-300 ${tone === "halt" ? "bg-halt" : "bg-lox-500 dark:bg-lox-300"}`}
          style={{ width: `${percent}%` }}
        />
      </div>
    </div>
  );
}

/** "3.2 MB", "200 MB", "812 kB", "640 bytes" (binary multiples, as the limits are stated). */
export function formatBytes(bytes: number): string {
  const megabytes = bytes / (1024 * 1024);
  if (megabytes >= 1) return `${Number.isInteger(megabytes) || megabytes >= 100 ? Math.round(megabytes) : megabytes.toFixed(1)} MB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} kB`;
  return `${bytes} bytes`;
}
