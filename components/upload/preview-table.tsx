"use client";

import { UPLOAD_LIMITS } from "@/lib/fleet-terms";
import { COLUMN_CHOICE_GROUPS, type ColumnChoice, type ColumnMapping } from "./capture-mapping";
import { DELIMITER_NAMES, type FilePreview } from "./preview-types";

/** Rows shown on the page; the rest of the parsed preview is only checked. */
const SHOWN_ROWS = 12;

interface PreviewTableProps {
  preview: FilePreview;
  mapping: ColumnMapping;
  onChange: (header: string, choice: ColumnChoice) => void;
  /** Column → a problem with its choice (from the form or the API). */
  columnErrors: Record<string, string>;
  /** Column → the first preview cell that is not a number. */
  nonNumbers: Record<string, { row: number; cell: string }>;
}

/** The first rows of the file with, under each column name, what it is read as. */
export function PreviewTable({ preview, mapping, onChange, columnErrors, nonNumbers }: PreviewTableProps) {
  const { headers, rows } = preview;
  const shown = rows.slice(0, SHOWN_ROWS);
  return (
    <div className="space-y-3">
      <p className="text-sm text-chart-muted" data-testid="preview-summary">
        Separated by{" "}
        <strong className="text-chart-ink" data-testid="preview-delimiter">
          {DELIMITER_NAMES[preview.delimiter] ?? preview.delimiter}
        </strong>{" "}
        · {headers.length} columns · {preview.rowCountExact ? "" : "about "}
        {preview.rowCount.toLocaleString("en-GB")} rows · the first {shown.length} of {rows.length} read are shown
      </p>
      {headers.length > UPLOAD_LIMITS.maxColumns ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          The file has {headers.length} columns; the limit is {UPLOAD_LIMITS.maxColumns}. Leave out columns the calibration does not need.
        </p>
      ) : null}
      {preview.rowCount > UPLOAD_LIMITS.maxRows ? (
        <p role="alert" className="rounded-lg border border-heed/40 bg-heed-soft px-3 py-2 text-sm">
          This file seems to hold more than {UPLOAD_LIMITS.maxRows.toLocaleString("en-GB")} rows, the limit: it will be refused when it is
          processed.
        </p>
      ) : null}
      {preview.ragged.length > 0 ? (
        <p className="rounded-lg border border-heed/40 bg-heed-soft px-3 py-2 text-sm">
          Data row {preview.ragged[0].row} has {preview.ragged[0].values} values where the header has {headers.length}; processing stops at
          such a row.
        </p>
      ) : null}
      <div className="overflow-x-auto rounded-lg border border-chart-rule" tabIndex={0} role="region" aria-label="Preview of the file">
        <table className="w-full min-w-max text-left text-sm">
          <thead className="bg-chart-paper align-top">
            <tr>
              <th scope="col" className="w-10 px-2 py-2 text-xs font-medium text-chart-muted">
                <span className="sr-only">Data row</span>
              </th>
              {headers.map((header, index) => {
                const selectId = `column-${index}`;
                const error = columnErrors[header];
                const bad = nonNumbers[header];
                const choice = mapping[header] ?? "ignore";
                return (
                  <th key={`${header}-${index}`} scope="col" className="min-w-[8.5rem] px-2 py-2 font-normal" data-testid="preview-column">
                    <span className="block truncate font-mono text-xs font-semibold" title={header}>
                      {header || `(column ${index + 1})`}
                    </span>
                    <label htmlFor={selectId} className="sr-only">
                      What column “{header}” holds
                    </label>
                    <select
                      id={selectId}
                      value={choice}
                      onChange={(event) => onChange(header, event.target.value)}
                      aria-invalid={error ? true : undefined}
                      aria-describedby={error ? `${selectId}-error` : bad ? `${selectId}-note` : undefined}
                      className={`field-input mt-1 px-2 py-1 font-mono text-xs ${choice === "ignore" ? "text-chart-muted" : ""}`}
                    >
                      {COLUMN_CHOICE_GROUPS.map((group) => (
                        <optgroup key={group.label} label={group.label}>
                          {group.options.map((option) => (
                            <option key={option.value} value={option.value}>
                              {option.label}
                            </option>
                          ))}
                        </optgroup>
                      ))}
                    </select>
                    {error ? (
                      <p
                        id={`${selectId}-error`}
                        role="alert"
                        className="mt-1 max-w-[12rem] whitespace-normal text-xs font-medium text-halt dark:text-red-300"
                      >
                        {error}
                      </p>
                    ) : bad ? (
                      <p id={`${selectId}-note`} className="mt-1 max-w-[12rem] whitespace-normal text-xs text-heed dark:text-amber-300">
                        Data row {bad.row} holds “{bad.cell.slice(0, 24)}”, not a number.
                      </p>
                    ) : null}
                  </th>
                );
              })}
            </tr>
          </thead>
          <tbody className="divide-y divide-chart-rule font-mono text-xs">
            {shown.map((cells, r) => (
              <tr key={r}>
                <td className="px-2 py-1 text-right text-chart-muted">{r + 1}</td>
                {headers.map((header, c) => (
                  <td
                    key={`${header}-${c}`}
                    className={`px-2 py-1 ${(mapping[header] ?? "ignore") === "ignore" ? "text-chart-muted" : ""}`}
                  >
                    {cells[c] ?? ""}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
