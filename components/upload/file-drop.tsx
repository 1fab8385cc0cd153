"use client";

import { useState, type DragEvent } from "react";
import { UPLOAD_LIMITS } from "@/lib/fleet-terms";
import { formatBytes } from "./progress-bar";

const ACCEPTED = /\.(csv|tsv|txt)$/i;

/** Why a file cannot be taken, or null when it can. Checked before a byte is read. */
export function refuseFile(file: File): string | null {
  if (!ACCEPTED.test(file.name)) return `“${file.name}” is not a CSV or TSV file: pick one whose name ends in .csv, .tsv or .txt.`;
  if (file.size === 0) return `“${file.name}” is empty.`;
  if (file.size > UPLOAD_LIMITS.maxBytes) {
    return `“${file.name}” is ${formatBytes(file.size)}; the limit is ${formatBytes(UPLOAD_LIMITS.maxBytes)}. Split the capture or log fewer columns.`;
  }
  return null;
}

/** The limits, in the words the page states them. */
export function limitsSentence(): string {
  const rows = UPLOAD_LIMITS.maxRows.toLocaleString("en-GB");
  return `CSV or TSV, up to ${formatBytes(UPLOAD_LIMITS.maxBytes)}, ${rows} rows and ${UPLOAD_LIMITS.maxColumns} columns, with at least ${UPLOAD_LIMITS.minSamples} samples.`;
}

/** Drop zone and file picker in one: the whole zone is the picker's label, so it works from the keyboard too. */
export function FileDrop({ file, error, onFile }: { file: File | null; error?: string; onFile: (file: File) => void }) {
  const [dragging, setDragging] = useState(false);
  const take = (files: FileList | null) => {
    const picked = files?.[0];
    if (picked) onFile(picked);
  };
  const onDrop = (event: DragEvent<HTMLDivElement>) => {
    event.preventDefault();
    setDragging(false);
    take(event.dataTransfer.files);
  };
  return (
    <div className="space-y-2">
      <div
        onDragOver={(event) => {
          event.preventDefault();
          setDragging(true);
        }}
        onDragLeave={() => setDragging(false)}
        onDrop={onDrop}
        className={`relative rounded-card border-2 border-dashed px-6 py-8 text-center transition focus-within:ring-2 focus-within:ring-brass-400 ${
          dragging ? "border-lox-500 bg-lox-50 dark:bg-lox-950" : error ? "border-halt" : "border-chart-rule"
        }`}
      >
        <label htmlFor="run-file" className="block cursor-pointer">
          <span className="block font-display text-lg font-semibold">{file ? file.name : "Drop the capture file here"}</span>
          <span className="mt-1 block text-sm text-chart-muted">
            {file ? `${formatBytes(file.size)} · ` : null}
            <span className="link">{file ? "choose another file" : "or choose one"}</span>
          </span>
        </label>
        <input
          id="run-file"
          name="file"
          type="file"
          accept=".csv,.tsv,.txt,text/csv,text/tab-separated-values,text/plain"
          className="sr-only"
          aria-describedby={error ? "run-file-error" : "run-file-limits"}
          aria-invalid={error ? true : undefined}
          onChange={(event) => {
            take(event.currentTarget.files);
            event.currentTarget.value = "";
          }}
        />
        <p id="run-file-limits" className="mt-3 text-xs text-chart-muted">
          {limitsSentence()}
        </p>
      </div>
      {error ? (
        <p id="run-file-error" role="alert" className="text-sm font-medium text-halt dark:text-red-300">
          {error}
        </p>
      ) : null}
    </div>
  );
}
