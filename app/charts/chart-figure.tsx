import { useRef, type ReactNode } from "react";
import { downloadCsv, downloadFigurePng, downloadFigureSvg } from "./figure-export";
import { plotCsv, type PlotTable } from "./plot-table";

export interface LegendEntry {
  label: string;
  colour: string;
  /** line: a stroke (dashed with `dash`); dot: a marker; area: a shaded band. */
  kind: "line" | "dot" | "area";
  dash?: string;
}

/**
 * One plot with its legend and its three exports (data as CSV, picture as SVG and PNG at the size
 * shown). The legend is drawn here, beside the recharts plot, from entries the chart names, and is
 * part of the exported picture (figure-export.ts reads it back from the page).
 */
export function ChartFigure({ name, title, legend, table, testId, children }: { name: string; title: string; legend: LegendEntry[]; table: PlotTable; testId: string; children: ReactNode }) {
  const figure = useRef<HTMLDivElement>(null);
  const button = "text-accent-strong hover:underline";
  return (
    <figure className="space-y-1" data-testid={testId}>
      <figcaption className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
        <span className="font-medium">{title}</span>
        <span className="ml-auto flex gap-3">
          <button type="button" className={button} onClick={() => downloadCsv(plotCsv(table), `${name}.csv`)}>
            Data (CSV)
          </button>
          <button type="button" className={button} onClick={() => figure.current && downloadFigureSvg(figure.current, `${name}.svg`)}>
            Chart (SVG)
          </button>
          <button type="button" className={button} onClick={() => void (figure.current && downloadFigurePng(figure.current, `${name}.png`))}>
            Chart (PNG)
          </button>
        </span>
      </figcaption>
      <div className="max-w-full overflow-x-auto rounded-md border border-line bg-surface">
        <div ref={figure} className="w-max bg-surface p-2" data-testid={`${testId}-picture`}>
          {/* w-0 min-w-full: the legend wraps within the plot's width instead of widening the figure */}
          <ul className="flex w-0 min-w-full flex-wrap gap-x-4 gap-y-1 px-2 pb-1 text-xs text-ink" data-testid="chart-legend">
            {legend.map((e) => (
              <li key={e.label} className="inline-flex items-center gap-1.5">
                <Swatch entry={e} />
                <span data-figure-text>{e.label}</span>
              </li>
            ))}
          </ul>
          {children}
        </div>
      </div>
    </figure>
  );
}

function Swatch({ entry }: { entry: LegendEntry }) {
  return (
    <svg width={24} height={12} viewBox="0 0 24 12" aria-hidden="true">
      {entry.kind === "line" && <line x1={1} y1={6} x2={23} y2={6} stroke={entry.colour} strokeWidth={2} strokeDasharray={entry.dash} />}
      {entry.kind === "dot" && <circle cx={12} cy={6} r={4.5} fill={entry.colour} stroke="#ffffff" strokeWidth={1.5} />}
      {entry.kind === "area" && <rect x={1} y={1} width={22} height={10} fill={entry.colour} />}
    </svg>
  );
}
