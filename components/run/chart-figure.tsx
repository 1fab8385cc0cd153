import type { ReactNode } from "react";

/**
 * A plot with its title and a caption that says in words what it shows (the text alternative:
 * the caption describes the chart to a screen reader and on paper alike).
 */
export function ChartFigure({
  id,
  title,
  caption,
  children,
  testId,
}: {
  id: string;
  title: string;
  caption: ReactNode;
  children: ReactNode;
  testId?: string;
}) {
  return (
    <figure
      aria-labelledby={`${id}-title`}
      aria-describedby={`${id}-caption`}
      className="card break-inside-avoid p-4 print:rounded-none print:border print:border-chart-rule print:shadow-none"
      data-testid={testId}
    >
      <h3 id={`${id}-title`} className="text-base font-semibold">
        {title}
      </h3>
      <div className="mt-2 h-64 w-full text-chart-muted print:h-52">{children}</div>
      <figcaption id={`${id}-caption`} className="mt-2 text-sm text-chart-muted print:text-xs print:text-chart-ink">
        {caption}
      </figcaption>
    </figure>
  );
}
