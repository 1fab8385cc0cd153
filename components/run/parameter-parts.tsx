import type { ReactNode } from "react";
import type { Mat3 } from "@/geometry/types";
import { formatNumber } from "./format";

const AXES = ["x", "y", "z"] as const;

/** Table cell classes shared by every parameters table, tight enough to print on one page. */
export const TH =
  "px-2 py-1 text-left text-xs font-semibold uppercase tracking-wide text-chart-muted print:px-1 print:py-0.5 print:text-chart-ink";
/** Row header naming a body axis: lower case, as the axes are written everywhere else. */
export const TH_AXIS =
  "px-2 py-1 text-left font-mono text-sm font-semibold text-chart-muted print:px-1 print:py-0.5 print:text-xs print:text-chart-ink";
export const TD = "whitespace-nowrap px-2 py-1 font-mono text-sm tabular-nums print:px-1 print:py-0.5 print:text-xs";
export const TABLE = "w-full border-collapse text-left [&_tbody_tr]:border-t [&_tbody_tr]:border-chart-rule";

/** A 3×3 matrix with its rows and columns named by body axis. */
export function MatrixTable({ matrix, caption, decimals = 4 }: { matrix: Mat3; caption: string; decimals?: number }) {
  return (
    <table className={`${TABLE} max-w-xs`}>
      <caption className="mb-1 text-left text-sm font-medium">{caption}</caption>
      <thead>
        <tr>
          <td className={TH} />
          {AXES.map((axis) => (
            <th key={axis} scope="col" className={`${TH_AXIS} text-right`}>
              {axis}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {matrix.map((row, r) => (
          <tr key={AXES[r]}>
            <th scope="row" className={TH_AXIS}>
              {AXES[r]}
            </th>
            {row.map((value, c) => (
              <td key={AXES[c]} className={`${TD} text-right`}>
                {formatNumber(value, decimals)}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A term and its value in a figures list. */
export function Figure({ term, children, testId }: { term: string; children: ReactNode; testId?: string }) {
  return (
    <div className="break-inside-avoid" data-testid={testId}>
      <dt className="text-xs uppercase tracking-wide text-chart-muted print:text-chart-ink">{term}</dt>
      <dd className="mt-0.5 text-sm">{children}</dd>
    </div>
  );
}

export { AXES };
