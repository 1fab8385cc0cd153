"use client";

export function PrintButton() {
  return (
    <button type="button" className="btn-quiet w-full" onClick={() => window.print()}>
      Print the report
    </button>
  );
}
