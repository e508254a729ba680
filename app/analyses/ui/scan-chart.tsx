import { useRef, useState } from "react";
import { CartesianGrid, Line, LineChart, ReferenceArea, Tooltip, XAxis, YAxis } from "recharts";
import { scanBranches } from "~/analyses/scan-branches";
import type { ScanResult } from "~/analyses/result-types";
import { downloadPng, downloadSvg } from "./download-svg";

const COLOURS = ["#2c6b66", "#a86a12", "#6b4c9a", "#9e3a36", "#3a7045", "#1f4f4b"];
const fmt = (v: number) => (Math.abs(v) >= 1000 || (Math.abs(v) < 0.01 && v !== 0) ? v.toExponential(2) : Number(v.toPrecision(3)).toString());

/**
 * A scan's positive steady states of one species against the parameter: stable branches solid,
 * unstable dashed; below it, the number of positive steady states, with multistable windows shaded.
 */
export function ScanChart({ scan, csvHref }: { scan: ScanResult; csvHref: string }) {
  const [species, setSpecies] = useState(scan.species[0] ?? "");
  const ref = useRef<HTMLDivElement>(null);
  const chart = scanBranches(scan, species);
  const log = scan.spacing === "log";
  const xAxis = <XAxis dataKey="x" type="number" scale={log ? "log" : "linear"} domain={["dataMin", "dataMax"]} tickFormatter={fmt} allowDataOverflow />;
  const name = scan.parameter.kind === "rate" ? scan.parameter.name : `${scan.parameter.name}(0)`;
  return (
    <div className="space-y-2" data-testid="scan-chart">
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <label className="inline-flex items-center gap-2">
          Species
          <select className="rounded-md border border-line bg-surface px-2 py-1" value={species} onChange={(e) => setSpecies(e.target.value)}>
            {scan.species.map((s) => (
              <option key={s}>{s}</option>
            ))}
          </select>
        </label>
        <span className="text-muted">
          <span className="mr-1 inline-block w-6 border-t-2 border-accent align-middle" /> stable
          <span className="ml-3 mr-1 inline-block w-6 border-t-2 border-dashed border-danger align-middle" /> unstable
        </span>
        <a href={csvHref} className="ml-auto text-accent-strong hover:underline" download>
          Plot data (CSV)
        </a>
        <button type="button" className="text-accent-strong hover:underline" onClick={() => downloadSvg(ref.current, `scan-${scan.parameter.name}-${species}.svg`)}>
          Chart (SVG)
        </button>
        <button type="button" className="text-accent-strong hover:underline" onClick={() => downloadPng(ref.current, `scan-${scan.parameter.name}-${species}.png`)}>
          Chart (PNG)
        </button>
      </div>
      {chart.multistable.length > 0 && (
        <p className="text-sm font-medium text-signal" data-testid="multistable">
          {chart.multistable.map((m) => `${m.count} positive steady states for ${name} from ${fmt(m.from)} to ${fmt(m.to)}`).join("; ")}
        </p>
      )}
      <div ref={ref} className="overflow-x-auto rounded-md border border-line bg-surface p-2">
        <LineChart width={760} height={320} data={chart.rows} margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid stroke="#eeede6" />
          {xAxis}
          <YAxis tickFormatter={fmt} label={{ value: species, angle: -90, position: "insideLeft" }} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toPrecision(6) : String(v))} labelFormatter={(v) => `${name} = ${fmt(Number(v))}`} />
          {chart.multistable.map((m, i) => (
            <ReferenceArea key={i} x1={m.from} x2={m.to} fill="#f8ecd6" fillOpacity={0.6} />
          ))}
          {Array.from({ length: chart.branches }, (_, b) => [
            <Line key={`s${b}`} dataKey={`s${b}`} name={`branch ${b + 1} stable`} stroke={COLOURS[0]} strokeWidth={2} dot={{ r: 2 }} connectNulls={false} isAnimationActive={false} />,
            <Line key={`u${b}`} dataKey={`u${b}`} name={`branch ${b + 1} unstable`} stroke={COLOURS[3]} strokeWidth={2} strokeDasharray="6 4" dot={{ r: 2 }} connectNulls={false} isAnimationActive={false} />,
          ])}
        </LineChart>
        <LineChart width={760} height={140} data={chart.counts.map((c) => ({ x: c.value, count: c.count }))} margin={{ top: 5, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid stroke="#eeede6" />
          {xAxis}
          <YAxis allowDecimals={false} label={{ value: "count", angle: -90, position: "insideLeft" }} domain={[0, "dataMax"]} />
          <Line dataKey="count" type="stepAfter" stroke={COLOURS[2]} strokeWidth={2} dot={{ r: 2 }} isAnimationActive={false} />
        </LineChart>
      </div>
      {scan.points.some((p) => p.states === null) && (
        <p className="text-xs text-muted">
          Points without a result: {scan.points.filter((p) => p.states === null).map((p) => `${fmt(p.value)} (${p.note ?? "not computed"})`).join(", ")}.
        </p>
      )}
    </div>
  );
}
