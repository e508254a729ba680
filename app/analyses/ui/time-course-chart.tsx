import { useRef } from "react";
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import type { TimeCourseResult } from "~/analyses/result-types";
import { downloadPng, downloadSvg } from "./download-svg";

const COLOURS = ["#2c6b66", "#a86a12", "#6b4c9a", "#9e3a36", "#3a7045", "#1f4f4b", "#56646c", "#b05a8a"];

/** Trajectories of every species, with the computed steady states of the class as thin dashed lines in the species' colour. */
export function TimeCourseChart({ course, steadyStates }: { course: TimeCourseResult; steadyStates: { concentrations: Record<string, number>; verdict: string }[] }) {
  const ref = useRef<HTMLDivElement>(null);
  const rows = course.t.map((t, i) => Object.fromEntries([["t", t], ...course.species.map((s, j) => [s, course.y[i]![j]!])]));
  return (
    <div className="space-y-2" data-testid="time-course-chart">
      <div className="flex items-center gap-3 text-sm text-muted">
        <span>{course.method}.</span>
        {course.note && <span className="text-signal">{course.note}</span>}
        <button type="button" className="ml-auto text-accent-strong hover:underline" onClick={() => downloadSvg(ref.current, "time-course.svg")}>
          Chart (SVG)
        </button>
        <button type="button" className="text-accent-strong hover:underline" onClick={() => downloadPng(ref.current, "time-course.png")}>
          Chart (PNG)
        </button>
      </div>
      <div ref={ref} className="overflow-x-auto rounded-md border border-line bg-surface p-2">
        <LineChart width={760} height={320} data={rows} margin={{ top: 10, right: 20, bottom: 20, left: 10 }}>
          <CartesianGrid stroke="#eeede6" />
          <XAxis dataKey="t" type="number" domain={[0, course.endTime]} tickFormatter={(v) => Number(v).toPrecision(3)} label={{ value: "time", position: "insideBottom", offset: -10 }} />
          <YAxis tickFormatter={(v) => Number(v).toPrecision(3)} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toPrecision(6) : String(v))} labelFormatter={(v) => `t = ${Number(v).toPrecision(4)}`} />
          <Legend verticalAlign="top" />
          {course.species.map((s, j) => (
            <Line key={s} dataKey={s} stroke={COLOURS[j % COLOURS.length]} dot={false} strokeWidth={2} isAnimationActive={false} />
          ))}
          {steadyStates.flatMap((st, k) =>
            course.species.map((s, j) => (
              <ReferenceLine key={`${k}-${s}`} y={st.concentrations[s]} stroke={COLOURS[j % COLOURS.length]} strokeDasharray={st.verdict === "stable" ? "2 3" : "8 4"} strokeOpacity={0.7} ifOverflow="extendDomain" />
            )),
          )}
        </LineChart>
      </div>
      <p className="text-xs text-muted">Dotted lines: stable steady states of the analysis' class; long dashes: unstable ones. A time course from other initial concentrations may lie in another class (other totals).</p>
    </div>
  );
}
