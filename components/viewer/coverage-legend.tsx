import { useId } from "react";
import { bandLabel, type CoverageBand } from "./coverage-bands";

/** Tints shared with the sphere's palette (scene-palette.ts) so both drawings read the same. */
export const CELL_TINT_CLASS = "text-lox-500 dark:text-lox-400";
export const EMPTY_TINT_CLASS = "text-heed dark:text-amber-400";
export const COMPASS_TINT_CLASSES = ["text-lox-800 dark:text-lox-100", "text-brass-600 dark:text-brass-300", "text-chart-muted"];

/** An id usable inside url(#…) whatever characters React puts in useId's answer. */
export function useSvgId(prefix: string): string {
  return `${prefix}-${useId().replace(/[^a-zA-Z0-9_-]/g, "")}`;
}

/** Diagonal stripes on a soft wash, in the empty-cell colour: the mark of a cell with too few samples. */
export function EmptyHatch({ id }: { id: string }) {
  return (
    <pattern id={id} patternUnits="userSpaceOnUse" width="6" height="6" patternTransform="rotate(45)">
      <rect width="6" height="6" className="fill-heed-soft" />
      <rect width="2.2" height="6" fill="currentColor" className={EMPTY_TINT_CLASS} />
    </pattern>
  );
}

function Swatch({ children }: { children: React.ReactNode }) {
  return (
    <svg viewBox="0 0 20 14" className="h-3.5 w-5 shrink-0" aria-hidden>
      {children}
    </svg>
  );
}

export interface CoverageLegendProps {
  bands: CoverageBand[];
  minSamplesPerCell: number;
  /** Show the largest-gap mark. */
  gap?: boolean;
  /** Point colours of the compasses drawn, in order (the sphere only). */
  compasses?: { label: string }[];
  /** Paired directions drawn (the sphere only). */
  pairs?: boolean;
}

/** What the tints, hatching and marks on the sphere and the flat map mean. */
export function CoverageLegend({ bands, minSamplesPerCell, gap = true, compasses, pairs }: CoverageLegendProps) {
  const hatchId = useSvgId("legend-hatch");
  return (
    <div className="text-xs text-chart-muted">
      <p className="mb-1 font-semibold text-chart-ink">Samples per cell</p>
      <ul className="flex flex-wrap gap-x-3 gap-y-1">
        <li className="flex items-center gap-1.5">
          <Swatch>
            <defs>
              <EmptyHatch id={hatchId} />
            </defs>
            <rect x="0.5" y="0.5" width="19" height="13" fill={`url(#${hatchId})`} stroke="currentColor" className={EMPTY_TINT_CLASS} />
          </Swatch>
          <span>
            {minSamplesPerCell > 1 ? `Under ${minSamplesPerCell}` : "None"} <span className="text-chart-muted">(empty)</span>
          </span>
        </li>
        {bands.map((band) => (
          <li key={band.from} className="flex items-center gap-1.5">
            <Swatch>
              <rect x="0.5" y="0.5" width="19" height="13" fill="currentColor" fillOpacity={band.opacity} className={CELL_TINT_CLASS} />
            </Swatch>
            <span>{bandLabel(band)}</span>
          </li>
        ))}
      </ul>
      {gap || compasses?.length || pairs ? (
        <ul className="mt-2 flex flex-wrap gap-x-3 gap-y-1">
          {gap ? (
            <li className="flex items-center gap-1.5">
              <Swatch>
                <circle
                  cx="10"
                  cy="7"
                  r="5.5"
                  fill="none"
                  stroke="currentColor"
                  strokeWidth="1.4"
                  strokeDasharray="3 2"
                  className="text-chart-ink"
                />
                <path d="M8 7h4M10 5v4" stroke="currentColor" strokeWidth="1.2" className="text-chart-ink" />
              </Swatch>
              <span>Largest gap and its centre</span>
            </li>
          ) : null}
          {compasses?.map((compass, k) => (
            <li key={compass.label} className="flex items-center gap-1.5">
              <Swatch>
                <circle cx="6" cy="7" r="2" fill="currentColor" className={COMPASS_TINT_CLASSES[k % COMPASS_TINT_CLASSES.length]} />
                <circle cx="13" cy="5" r="2" fill="currentColor" className={COMPASS_TINT_CLASSES[k % COMPASS_TINT_CLASSES.length]} />
                <circle cx="15" cy="10" r="2" fill="currentColor" className={COMPASS_TINT_CLASSES[k % COMPASS_TINT_CLASSES.length]} />
              </Swatch>
              <span>{compass.label}</span>
            </li>
          ))}
          {pairs ? (
            <li className="flex items-center gap-1.5">
              <Swatch>
                <path d="M4 10 L16 4" stroke="currentColor" strokeWidth="1.2" className="text-chart-muted" />
                <circle cx="4" cy="10" r="2.2" fill="currentColor" className={COMPASS_TINT_CLASSES[0]} />
                <circle cx="16" cy="4" r="2.2" fill="currentColor" className={COMPASS_TINT_CLASSES[1]} />
              </Swatch>
              <span>Same instant, two compasses</span>
            </li>
          ) : null}
        </ul>
      ) : null}
    </div>
  );
}
