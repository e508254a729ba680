import type { AnalysisPageData } from "~/analyses/page.server";
import { Assumptions, ResultsView } from "./results-view";
import { RelationPanel, ScanPanel, TimeCoursePanel } from "./follow-ups";
import { AnalysedNetworkView } from "./analysed-network-view";
import { ProgressPanel } from "./progress-panel";
import { DistributedRuns } from "./distributed-runs";
import { StatusBadge } from "./status";
import { isNotReached, stageLabel } from "../stages";

/** Above a partial result: why it is partial and which stages it lacks. */
function PartialNotice({ status, unfinished }: { status: string; unfinished: { stage: string; reason: string }[] }) {
  const why = status === "cancelled" ? "The run was cancelled" : status === "failed" ? "The run stopped before it finished" : "The run is still going";
  const missing = unfinished.map((u) => `${stageLabel(u.stage)}${isNotReached(u.reason) ? "" : " (ran out of time or size)"}`);
  return (
    <div className="rounded-md border border-signal bg-surface px-4 py-3 text-sm" data-testid="partial-result" role="status">
      <p>
        <b>Partial result.</b> {why}; what it had finished is shown below. Scans, tests, time courses and downloads need a finished run.
      </p>
      {missing.length > 0 && <p className="mt-1" data-testid="partial-missing">Not finished: {missing.join("; ")}.</p>}
    </div>
  );
}

function Part({ id, title, help, children }: { id: string; title: string; help: string; children: React.ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="space-y-3 border-t border-line pt-5">
      <h2 id={`${id}-title`} className="text-lg font-semibold tracking-tight">
        {title}
      </h2>
      <p className="max-w-prose text-sm text-muted">{help}</p>
      {children}
    </section>
  );
}

/** The analysis as the lab sees it; `canEdit` false gives the read-only view (viewers, share links). */
export function AnalysisBody({ d, canEdit, exportBase, scanCsvBase }: { d: AnalysisPageData; canEdit: boolean; exportBase: string; scanCsvBase: string }) {
  const p = d.params;
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <StatusBadge status={d.job.status} />
        <span className="text-sm text-muted" data-testid="pinned">
          {d.job.network.name}, version {d.job.network.version} · engine {d.job.engineVersion}
        </span>
      </div>
      <dl className="grid grid-cols-1 gap-x-6 gap-y-1 text-sm sm:grid-cols-2" data-testid="settings">
        <div>
          <dt className="inline text-muted">Order: </dt>
          <dd className="inline font-mono">{p.order ? p.order.join(" > ") : "suggested"}{p.free.length > 0 ? `; free: ${p.free.join(", ")}` : ""}</dd>
        </div>
        <div>
          <dt className="inline text-muted">Rate constants: </dt>
          <dd className="inline">{p.rateMode}{Object.keys(p.rateValues).length > 0 ? ` (${Object.entries(p.rateValues).map(([k, v]) => `${k}=${v}`).join(", ")})` : ""}</dd>
        </div>
        <div>
          <dt className="inline text-muted">Initial concentrations: </dt>
          <dd className="inline font-mono">{p.initial ? Object.entries(p.initial).map(([k, v]) => `${k}=${v}`).join(", ") : "none (symbolic totals)"}</dd>
        </div>
        <div>
          <dt className="inline text-muted">Limits: </dt>
          <dd className="inline">{p.timeLimitSeconds} s, basis ≤ {p.maxBasisSize} polynomials</dd>
        </div>
      </dl>
      <ProgressPanel job={d.job} canCancel={canEdit} />
      <DistributedRuns runs={d.distributed} />
      {d.job.error && (
        <p role="alert" className="rounded-md border border-danger bg-danger-soft px-4 py-3 text-sm text-danger" data-testid="job-error">
          {d.job.error}
        </p>
      )}
      {d.result && d.view && d.partial && (
        <>
          <PartialNotice status={d.job.status} unfinished={d.result.unfinished ?? []} />
          <ResultsView view={d.view} result={d.result} />
        </>
      )}
      {d.result && d.view && !d.partial && (
        <>
          <div className="flex flex-wrap items-center gap-3 text-sm">
            <span className="text-muted">Download:</span>
            {["result.json", "parametrisation.csv", "steady-states.csv", "formulas.tex"].map((f) => (
              <a key={f} href={`${exportBase}/${f}`} className="text-accent-strong hover:underline" download>
                {f}
              </a>
            ))}
          </div>
          <div className="grid grid-cols-1 gap-6 lg:grid-cols-[minmax(0,1fr)_18rem]">
            <ResultsView view={d.view} result={d.result} />
            <div className="lg:sticky lg:top-4 lg:self-start">
              <Assumptions numeric={d.numeric} />
            </div>
          </div>
          <details className="rounded-md border border-line bg-surface px-4 py-2 text-sm" data-testid="analysed-network" open={!canEdit}>
            <summary className="cursor-pointer font-medium">
              Reactions and rate values analysed ({d.network.reactions.length} reaction{d.network.reactions.length === 1 ? "" : "s"}, version {d.job.network.version})
            </summary>
            <div className="mt-2">
              <AnalysedNetworkView network={d.network} />
            </div>
          </details>
          <Part id="relation" title="Relation test" help="Does an expression vanish at every positive steady state? Decided exactly by ideal membership in the saturated steady-state ideal; if not, the remainder is shown.">
            <RelationPanel jobs={d.relations} canEdit={canEdit} />
          </Part>
          <Part id="scan" title="Parameter scan" help="Vary one rate constant or one initial concentration over a range; every point is a full exact steady-state count with stability, so a bistable window shows at a glance.">
            <ScanPanel jobs={d.scans} canEdit={canEdit} rates={d.rates} species={d.species} csvHref={(id) => `${scanCsvBase}/scan-${id}.csv`} available={d.numeric} />
          </Part>
          <Part id="time-course" title="Time course" help="Simulate the mass-action ODEs from the initial concentrations with a stiff integrator and see whether the trajectory settles on a computed steady state.">
            <TimeCoursePanel jobs={d.timeCourses} canEdit={canEdit} steadyStates={d.result.steadyStates ?? []} available={d.numeric} start={d.params.initial} />
          </Part>
        </>
      )}
    </div>
  );
}
