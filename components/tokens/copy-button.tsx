"use client";

import { useState } from "react";

/** Copies `text` to the clipboard and says so; where the clipboard is refused, says to select it. */
export function CopyButton({ text, label }: { text: string; label: string }) {
  const [said, setSaid] = useState<string | null>(null);
  return (
    <span className="inline-flex items-center gap-3">
      <button
        type="button"
        className="btn-quiet py-1.5"
        onClick={async () => {
          try {
            await navigator.clipboard.writeText(text);
            setSaid("Copied.");
          } catch {
            setSaid("The browser refused the clipboard: select the text and copy it.");
          }
        }}
      >
        {label}
      </button>
      <span aria-live="polite" className="text-xs text-chart-muted">
        {said}
      </span>
    </span>
  );
}
