export interface HeadColumn {
  label: string;
  /** Right-align numeric columns. */
  numeric?: boolean;
}

/**
 * The header row of the app's simple (unsorted) tables: first column indented like the card
 * heading, numeric columns right-aligned, and an unlabelled actions column when asked for.
 */
export function TableHead({
  columns,
  actions = false,
  inset = "px-6",
  padding = "px-4",
}: {
  columns: (string | HeadColumn)[];
  actions?: boolean;
  /** Horizontal padding of the first and the actions column, and of the others. */
  inset?: string;
  padding?: string;
}) {
  return (
    <thead className="border-y border-chart-rule bg-chart-paper text-xs uppercase tracking-wide text-chart-muted">
      <tr>
        {columns.map((column, index) => {
          const { label, numeric } = typeof column === "string" ? { label: column, numeric: false } : column;
          return (
            <th key={label} scope="col" className={`${index === 0 ? inset : padding} py-2 font-medium ${numeric ? "text-right" : ""}`}>
              {label}
            </th>
          );
        })}
        {actions ? (
          <th scope="col" className={`${inset} py-2 font-medium`}>
            <span className="sr-only">Actions</span>
          </th>
        ) : null}
      </tr>
    </thead>
  );
}
