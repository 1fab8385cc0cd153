"use client";

import type { ColumnChoice, ColumnMapping, MappingReview, UnitQuantity } from "./capture-mapping";
import { PreviewTable } from "./preview-table";
import type { FilePreview } from "./preview-types";
import { UnitFields } from "./unit-fields";

/** Step 2 of the form: the preview with each column's meaning, what is wrong with the mapping, and the units. */
export function ColumnSection({
  preview,
  previewError,
  review,
  mapping,
  onMappingChange,
  nonNumbers,
  units,
  onUnitChange,
  errors,
}: {
  preview: FilePreview | null;
  previewError: string | null;
  review: MappingReview | null;
  mapping: ColumnMapping;
  onMappingChange: (header: string, choice: ColumnChoice) => void;
  nonNumbers: Record<string, { row: number; cell: string }>;
  units: Partial<Record<UnitQuantity, string>>;
  onUnitChange: (quantity: UnitQuantity, value: string) => void;
  errors: Record<string, string>;
}) {
  if (previewError) {
    return (
      <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
        {previewError}
      </p>
    );
  }
  if (!preview || !review) {
    return (
      <p role="status" className="text-sm text-chart-muted">
        Reading the first rows…
      </p>
    );
  }
  const columnErrors: Record<string, string> = { ...review.columnProblems };
  for (const [key, message] of Object.entries(errors)) {
    if (key.startsWith("columnMapping.")) columnErrors[key.slice("columnMapping.".length)] = message;
  }
  return (
    <>
      <PreviewTable preview={preview} mapping={mapping} onChange={onMappingChange} columnErrors={columnErrors} nonNumbers={nonNumbers} />
      {review.problems.length > 0 ? (
        <ul
          role="alert"
          className="space-y-1 rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm"
          data-testid="mapping-problems"
        >
          {review.problems.map((problem) => (
            <li key={problem}>{problem}</li>
          ))}
        </ul>
      ) : errors.columnMapping ? (
        <p role="alert" className="text-sm font-medium text-halt dark:text-red-300">
          {errors.columnMapping}
        </p>
      ) : null}
      <h3 className="pt-2 font-semibold">Units as logged</h3>
      <UnitFields quantities={review.quantities} values={units} hints={review.unitHints} errors={errors} onChange={onUnitChange} />
    </>
  );
}
