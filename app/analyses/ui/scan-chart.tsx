import { useState } from "react";
import { CartesianGrid, Line, LineChart, ReferenceArea, ReferenceDot, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { ChartFigure, type LegendEntry } from "~/charts/chart-figure";
import { fileStem } from "~/charts/plot-table";
import { exactBranches, scanBranches } from "~/analyses/scan-branches";
import { exactBranchTable, exactCountTable, scanBranchTable, scanCountTable, scanParameterName } from "~/analyses/plot-tables";
import type { ScanResult } from "~/analyses/result-types";

const COLOURS = ["#2c6b66", "#a86a12", "#6b4c9a", "#9e3a36", "#3a7045", "#1f4f4b"];
const SHADE = "#f8ecd6";
const FOLD = "#1b1b18";
const fmt = (v: number) => (Math.abs(v) >= 1000 || (Math.abs(v) < 0.01 && v !== 0) ? v.toExponential(2) : Number(v.toPrecision(3)).toString());

function branchLegend(multistable: boolean, folds: boolean): LegendEntry[] {
  const legend: LegendEntry[] = [
    { label: "stable", colour: COLOURS[0]!, kind: "line" },
    { label: "unstable", colour: COLOURS[3]!, kind: "line", dash: "6 4" },
  ];
  if (folds) legend.push({ label: "fold point", colour: FOLD, kind: "dot" });
  if (multistable) legend.push({ label: "several positive steady states", colour: SHADE, kind: "area" });
  return legend;
}
const COUNT_LEGEND: LegendEntry[] = [{ label: "number of positive steady states", colour: COLOURS[2]!, kind: "line" }];

function SpeciesPicker({ scan, species, setSpecies, csvHref }: { scan: ScanResult; species: string; setSpecies: (s: string) => void; csvHref: string }) {
  return (
    <div className="flex flex-wrap items-center gap-3 text-sm">
      <label className="inline-flex items-center gap-2">
        Species
        <select className="rounded-md border border-line bg-surface px-2 py-1" value={species} onChange={(e) => setSpecies(e.target.value)}>
          {scan.species.map((s) => (
            <option key={s}>{s}</option>
          ))}
        </select>
      </label>
      <a href={csvHref} className="ml-auto text-accent-strong hover:underline" download>
        All steady states, every species (CSV)
      </a>
    </div>
  );
}

/**
 * A scan's positive steady states of one species against the parameter: stable branches solid,
 * unstable dashed; below it, the number of positive steady states, with multistable windows shaded.
 */
export function ScanChart({ scan, csvHref }: { scan: ScanResult; csvHref: string }) {
  const [species, setSpecies] = useState(scan.species[0] ?? "");
  if (scan.exact) return <ExactScanChart scan={scan} csvHref={csvHref} species={species} setSpecies={setSpecies} />;
  const chart = scanBranches(scan, species);
  const log = scan.spacing === "log";
  const name = scanParameterName(scan);
  const xAxis = <XAxis dataKey="x" type="number" scale={log ? "log" : "linear"} domain={["dataMin", "dataMax"]} tickFormatter={fmt} allowDataOverflow label={{ value: name, position: "insideBottom", offset: -15 }} />;
  return (
    <div className="space-y-2" data-testid="scan-chart">
      <SpeciesPicker scan={scan} species={species} setSpecies={setSpecies} csvHref={csvHref} />
      {chart.multistable.length > 0 && (
        <p className="text-sm font-medium text-signal" data-testid="multistable">
          {chart.multistable.map((m) => `${m.count} positive steady states for ${name} from ${fmt(m.from)} to ${fmt(m.to)}`).join("; ")}
        </p>
      )}
      <ChartFigure name={fileStem("scan", scan.parameter.name, species)} title={`Steady states of ${species} against ${name}`} legend={branchLegend(chart.multistable.length > 0, false)} table={scanBranchTable(scan, species, chart)} testId="scan-branches-figure">
        <LineChart width={760} height={320} data={chart.rows} margin={{ top: 10, right: 20, bottom: 25, left: 15 }}>
          <CartesianGrid stroke="#eeede6" />
          {xAxis}
          <YAxis tickFormatter={fmt} label={{ value: species, angle: -90, position: "insideLeft", offset: -5 }} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toPrecision(6) : String(v))} labelFormatter={(v) => `${name} = ${fmt(Number(v))}`} />
          {chart.multistable.map((m, i) => (
            <ReferenceArea key={i} x1={m.from} x2={m.to} fill={SHADE} fillOpacity={0.6} />
          ))}
          {Array.from({ length: chart.branches }, (_, b) => [
            <Line key={`s${b}`} dataKey={`s${b}`} name={`branch ${b + 1} stable`} stroke={COLOURS[0]} strokeWidth={2} dot={{ r: 2 }} connectNulls={false} isAnimationActive={false} />,
            <Line key={`u${b}`} dataKey={`u${b}`} name={`branch ${b + 1} unstable`} stroke={COLOURS[3]} strokeWidth={2} strokeDasharray="6 4" dot={{ r: 2 }} connectNulls={false} isAnimationActive={false} />,
          ])}
        </LineChart>
      </ChartFigure>
      <ChartFigure name={fileStem("scan-count", scan.parameter.name)} title={`Number of positive steady states against ${name}`} legend={COUNT_LEGEND} table={scanCountTable(scan, chart)} testId="scan-count-figure">
        <LineChart width={760} height={160} data={chart.counts.map((c) => ({ x: c.value, count: c.count }))} margin={{ top: 5, right: 20, bottom: 25, left: 15 }}>
          <CartesianGrid stroke="#eeede6" />
          {xAxis}
          <YAxis allowDecimals={false} label={{ value: "count", angle: -90, position: "insideLeft", offset: -5 }} domain={[0, "dataMax"]} />
          <Line dataKey="count" type="stepAfter" stroke={COLOURS[2]} strokeWidth={2} dot={{ r: 2 }} isAnimationActive={false} />
        </LineChart>
      </ChartFigure>
      {scan.exactNote && <p className="text-xs text-muted">{scan.exactNote}</p>}
      {scan.points.some((p) => p.states === null) && (
        <p className="text-xs text-muted">
          Points without a result: {scan.points.filter((p) => p.states === null).map((p) => `${fmt(p.value)} (${p.note ?? "not computed"})`).join(", ")}.
        </p>
      )}
    </div>
  );
}

const sig = (v: number) => Number(v.toPrecision(10)).toString();

/**
 * The exact scan: each branch a continuous curve (tracked between points, joined at the folds),
 * stable runs solid and unstable dashed, fold points marked, exact windows with several positive
 * steady states shaded; below it the exact count on each window.
 */
function ExactScanChart({ scan, csvHref, species, setSpecies }: { scan: ScanResult; csvHref: string; species: string; setSpecies: (s: string) => void }) {
  const exact = scan.exact!;
  const chart = exactBranches(exact, species);
  const log = scan.spacing === "log" && exact.curve.every((p) => p.value > 0);
  const xs = exact.curve.map((p) => p.value);
  const domain: [number, number] = [Math.min(...xs), Math.max(...xs)];
  const name = scanParameterName(scan);
  const xAxis = <XAxis dataKey="x" type="number" scale={log ? "log" : "linear"} domain={domain} tickFormatter={fmt} allowDataOverflow allowDuplicatedCategory={false} label={{ value: name, position: "insideBottom", offset: -15 }} />;
  const counts = exact.windows.flatMap((w) => [{ x: Math.max(w.from, domain[0]), count: w.count }, { x: Math.min(w.to, domain[1]), count: w.count }]);
  return (
    <div className="space-y-2" data-testid="scan-chart" data-exact="true">
      <SpeciesPicker scan={scan} species={species} setSpecies={setSpecies} csvHref={csvHref} />
      {chart.multistable.length > 0 && (
        <p className="text-sm font-medium text-signal" data-testid="multistable">
          {chart.multistable.map((m) => `${m.count} positive steady states for ${sig(m.from)} < ${name} < ${sig(m.to)}`).join("; ")} (exact window between fold points)
        </p>
      )}
      <ChartFigure name={fileStem("scan", scan.parameter.name, species)} title={`Steady states of ${species} against ${name}`} legend={branchLegend(chart.multistable.length > 0, chart.foldMarkers.length > 0)} table={exactBranchTable(scan, species, chart)} testId="scan-branches-figure">
        <LineChart width={760} height={320} margin={{ top: 10, right: 20, bottom: 25, left: 15 }}>
          <CartesianGrid stroke="#eeede6" />
          {xAxis}
          <YAxis dataKey="y" type="number" tickFormatter={fmt} label={{ value: species, angle: -90, position: "insideLeft", offset: -5 }} domain={["auto", "auto"]} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toPrecision(6) : String(v))} labelFormatter={(v) => `${name} = ${fmt(Number(v))}`} />
          {chart.multistable.map((m, i) => (
            <ReferenceArea key={`w${i}`} x1={Math.max(m.from, domain[0])} x2={Math.min(m.to, domain[1])} fill={SHADE} fillOpacity={0.6} />
          ))}
          {exact.folds.map((f, i) => (
            <ReferenceLine key={`f${i}`} x={f.value} stroke="#8a8778" strokeDasharray="2 3" />
          ))}
          {chart.segments.map((seg, i) => (
            <Line
              key={`seg${i}`}
              data={seg.data}
              dataKey="y"
              name={`branch ${seg.branch + 1} ${seg.stable ? "stable" : "unstable"}`}
              className={seg.stable ? "branch-stable" : "branch-unstable"}
              stroke={seg.stable ? COLOURS[0] : COLOURS[3]}
              strokeWidth={2}
              strokeDasharray={seg.stable ? undefined : "6 4"}
              dot={false}
              isAnimationActive={false}
            />
          ))}
          {chart.foldMarkers.map((m, i) => (
            <ReferenceDot
              key={`m${i}`}
              x={m.x}
              y={m.y}
              r={4}
              shape={(p: { cx?: number; cy?: number }) => <circle cx={p.cx} cy={p.cy} r={4.5} fill={FOLD} stroke="#ffffff" strokeWidth={1.5} data-testid="fold-marker" />}
            />
          ))}
        </LineChart>
      </ChartFigure>
      <ChartFigure name={fileStem("scan-count", scan.parameter.name)} title={`Number of positive steady states against ${name} (exact)`} legend={COUNT_LEGEND} table={exactCountTable(scan)} testId="scan-count-figure">
        <LineChart width={760} height={160} data={counts} margin={{ top: 5, right: 20, bottom: 25, left: 15 }}>
          <CartesianGrid stroke="#eeede6" />
          {xAxis}
          <YAxis allowDecimals={false} label={{ value: "count", angle: -90, position: "insideLeft", offset: -5 }} domain={[0, "dataMax"]} />
          <Line dataKey="count" type="linear" stroke={COLOURS[2]} strokeWidth={2} dot={false} isAnimationActive={false} />
        </LineChart>
      </ChartFigure>
      <div className="text-sm" data-testid="fold-points">
        {exact.folds.length === 0 ? (
          <p className="text-muted">No fold point in this range: the number of positive steady states is the same throughout.</p>
        ) : (
          <ul className="space-y-0.5">
            {exact.folds.map((f, i) => (
              <li key={i} data-testid="fold-point" className="font-mono">
                fold at {name} = {sig(f.value)} <span className="text-muted">(isolated in [{f.interval[0]}, {f.interval[1]}])</span>
              </li>
            ))}
          </ul>
        )}
        <ul className="mt-1 text-muted" data-testid="scan-windows">
          {exact.windows.map((w, i) => (
            <li key={i}>
              {sig(w.from)} &lt; {name} &lt; {sig(w.to)}: {w.count} positive steady state{w.count === 1 ? "" : "s"}
            </li>
          ))}
        </ul>
        <p className="mt-1 text-xs text-muted">Assumes: {exact.assumptions}</p>
      </div>
    </div>
  );
}
