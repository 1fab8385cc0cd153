const FORMATS = [
  { format: "correction-json", label: "Correction (JSON)", hint: "offset and matrix per sensor, with the run's details" },
  { format: "correction-csv", label: "Correction (CSV)", hint: "one number per row, for a spreadsheet" },
  { format: "c-header", label: "Correction (C header)", hint: "static arrays to compile into firmware" },
  { format: "results-json", label: "Full results (JSON)", hint: "every fit, check and measurement of this version" },
] as const;

/** Download links for the version on screen; the server sends each as a file. */
export function ExportsMenu({ base, versionId }: { base: string; versionId: string }) {
  return (
    <ul className="space-y-2 text-sm">
      {FORMATS.map((f) => (
        <li key={f.format}>
          <a href={`${base}/export?format=${f.format}&version=${versionId}`} className="link" download data-export={f.format}>
            {f.label}
          </a>
          <span className="block text-xs text-chart-muted">{f.hint}</span>
        </li>
      ))}
    </ul>
  );
}
