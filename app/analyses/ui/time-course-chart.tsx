import { CartesianGrid, Line, LineChart, ReferenceLine, Tooltip, XAxis, YAxis } from "recharts";
import { ChartFigure, type LegendEntry } from "~/charts/chart-figure";
import type { TimeCourseResult } from "~/analyses/result-types";
import { timeCourseTable } from "~/analyses/plot-tables";

const COLOURS = ["#2c6b66", "#a86a12", "#6b4c9a", "#9e3a36", "#3a7045", "#1f4f4b", "#56646c", "#b05a8a"];
const STEADY_STATE_GREY = "#56646c";

/** Trajectories of every species, with the computed steady states of the class as thin dashed lines in the species' colour. */
export function TimeCourseChart({ course, steadyStates }: { course: TimeCourseResult; steadyStates: { concentrations: Record<string, number>; verdict: string }[] }) {
  const table = timeCourseTable(course);
  const legend: LegendEntry[] = course.species.map((s, j) => ({ label: s, colour: COLOURS[j % COLOURS.length]!, kind: "line" }));
  if (steadyStates.some((s) => s.verdict === "stable")) legend.push({ label: "stable steady state", colour: STEADY_STATE_GREY, kind: "line", dash: "2 3" });
  if (steadyStates.some((s) => s.verdict !== "stable")) legend.push({ label: "unstable steady state", colour: STEADY_STATE_GREY, kind: "line", dash: "8 4" });
  return (
    <div className="space-y-2" data-testid="time-course-chart">
      <p className="text-sm text-muted">
        {course.method}.{course.note && <span className="ml-2 text-signal">{course.note}</span>}
      </p>
      <ChartFigure name="time-course" title="Concentrations over time" legend={legend} table={table} testId="time-course-figure">
        <LineChart width={760} height={320} data={table.rows} margin={{ top: 10, right: 20, bottom: 25, left: 15 }}>
          <CartesianGrid stroke="#eeede6" />
          <XAxis dataKey="time" type="number" domain={[0, course.endTime]} tickFormatter={(v) => Number(v).toPrecision(3)} label={{ value: "time", position: "insideBottom", offset: -15 }} />
          <YAxis tickFormatter={(v) => Number(v).toPrecision(3)} label={{ value: "concentration", angle: -90, position: "insideLeft", offset: -5 }} />
          <Tooltip formatter={(v) => (typeof v === "number" ? v.toPrecision(6) : String(v))} labelFormatter={(v) => `t = ${Number(v).toPrecision(4)}`} />
          {course.species.map((s, j) => (
            <Line key={s} dataKey={s} stroke={COLOURS[j % COLOURS.length]} dot={false} strokeWidth={2} isAnimationActive={false} />
          ))}
          {steadyStates.flatMap((st, k) =>
            course.species.map((s, j) => (
              <ReferenceLine key={`${k}-${s}`} y={st.concentrations[s]} stroke={COLOURS[j % COLOURS.length]} strokeDasharray={st.verdict === "stable" ? "2 3" : "8 4"} strokeOpacity={0.7} ifOverflow="extendDomain" />
            )),
          )}
        </LineChart>
      </ChartFigure>
      <p className="text-xs text-muted">
        Time and concentrations are in the units the rate constants and initial concentrations were given in. Dotted lines: stable steady states of the analysis' class, in each species' colour; long dashes: unstable ones. A time course from other initial concentrations may lie in another class (other totals).
      </p>
    </div>
  );
}
