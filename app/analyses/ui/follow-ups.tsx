import { useFetcher } from "react-router";
import type { ScanParams, TimeCourseParams } from "~/analyses/params";
import type { JobJson } from "~/analyses/repository.server";
import type { RelationJobResult, ScanResult, StoredSteadyState, TimeCourseResult } from "~/analyses/result-types";
import { Problems } from "./problems";
import { ScanChart } from "./scan-chart";
import { StatusBadge, isUnfinished } from "./status";
import { TimeCourseChart } from "./time-course-chart";
import { formatDateTime } from "~/shared/dates";

type Child = JobJson & { result?: unknown };
const field = "rounded-md border border-line bg-surface px-2 py-1 text-sm";
const button = "rounded-md bg-accent px-3 py-1.5 text-sm font-medium text-accent-ink hover:bg-accent-strong disabled:opacity-60";

function JobLine({ job, canEdit, children }: { job: Child; canEdit: boolean; children?: React.ReactNode }) {
  const fetcher = useFetcher();
  return (
    <li className="space-y-2 rounded-md border border-line bg-surface px-4 py-3" data-testid={`${job.kind}-job`}>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <StatusBadge status={job.status} />
        <span className="text-muted">{formatDateTime(job.createdAt)}
          {job.startedBy ? ` · ${job.startedBy}` : ""}</span>
        {isUnfinished(job.status) && <span className="text-muted">{String((job.progress as { message?: string }).message ?? "")}</span>}
        {isUnfinished(job.status) && canEdit && (
          <fetcher.Form method="post" className="ml-auto">
            <input type="hidden" name="intent" value="cancel" />
            <input type="hidden" name="jobId" value={job.id} />
            <button className="text-danger hover:underline" disabled={job.cancelRequested}>
              {job.cancelRequested ? "Cancelling…" : "Cancel"}
            </button>
          </fetcher.Form>
        )}
      </div>
      {job.error && <p className="text-sm text-danger">{job.error}</p>}
      {job.status === "succeeded" && children}
    </li>
  );
}

/**
 * The newest job's stored parameters, so a form opens with the values of the last run (`jobs` is
 * newest first) rather than the defaults; null when nothing ran yet.
 */
export function lastParams<T>(jobs: Child[]): Partial<T> | null {
  return (jobs[0]?.params as Partial<T> | undefined) ?? null;
}

function StartForm({ intent, children, label }: { intent: string; children: React.ReactNode; label: string }) {
  const fetcher = useFetcher<{ problems?: { field: string; message: string }[] }>();
  return (
    <fetcher.Form method="post" className="space-y-2" data-testid={`${intent}-form`}>
      <input type="hidden" name="intent" value={intent} />
      {fetcher.data?.problems && <Problems problems={fetcher.data.problems} />}
      <div className="flex flex-wrap items-end gap-3">
        {children}
        <button type="submit" className={button} disabled={fetcher.state !== "idle"}>
          {fetcher.state !== "idle" ? "Starting…" : label}
        </button>
      </div>
    </fetcher.Form>
  );
}

export function RelationPanel({ jobs, canEdit }: { jobs: Child[]; canEdit: boolean }) {
  return (
    <div className="space-y-3">
      {canEdit && (
        <StartForm intent="relation" label="Test">
          <label className="flex-1 space-y-0.5 text-sm">
            <span className="block">Expression in species and rate constants</span>
            <input name="expression" className={`${field} w-full font-mono`} placeholder="e.g. k1*E*S - (koff + kcat)*C" required />
          </label>
        </StartForm>
      )}
      <ul className="space-y-2">
        {jobs.map((j) => {
          const r = j.result as RelationJobResult | undefined;
          const expr = (j.params as { expression?: string }).expression;
          return (
            <JobLine key={j.id} job={j} canEdit={canEdit}>
              <div className="text-sm" data-testid="relation-verdict">
                <span className="font-mono">{r?.relation?.expression ?? expr}</span>:{" "}
                {!r?.relation ? (
                  <span className="text-muted">not decided ({r?.warnings.join(" ") || "no result"})</span>
                ) : r.relation.inIdeal ? (
                  <b className="text-ok">holds at every positive steady state (in the saturated ideal; remainder 0)</b>
                ) : r.relation.vanishes ? (
                  <b className="text-ok">vanishes at every positive steady state (in the radical of the saturated ideal, not the ideal itself)</b>
                ) : (
                  <>
                    <b className="text-danger">does not hold at every positive steady state</b>; remainder <span className="font-mono">{r.relation.remainder}</span>
                  </>
                )}
              </div>
            </JobLine>
          );
        })}
      </ul>
    </div>
  );
}

export function ScanPanel({ jobs, canEdit, rates, species, csvHref, available }: { jobs: Child[]; canEdit: boolean; rates: string[]; species: string[]; csvHref: (id: string) => string; available: boolean }) {
  const last = lastParams<ScanParams>(jobs);
  const choice = last?.parameter ? `${last.parameter.kind}:${last.parameter.name}` : rates[0] ? `rate:${rates[0]}` : undefined;
  return (
    <div className="space-y-3">
      {canEdit && available && (
        // Keyed by the newest scan: once a scan is started the form shows its values again.
        <StartForm key={jobs[0]?.id ?? "none"} intent="scan" label="Run scan">
          <label className="space-y-0.5 text-sm">
            <span className="block">Vary</span>
            <select name="parameterChoice" className={field} defaultValue={choice}>
              {rates.map((r) => (
                <option key={r} value={`rate:${r}`}>
                  rate constant {r}
                </option>
              ))}
              {species.map((s) => (
                <option key={s} value={`initial:${s}`}>
                  initial {s} (moves the totals)
                </option>
              ))}
            </select>
          </label>
          <label className="space-y-0.5 text-sm">
            <span className="block">from</span>
            <input name="from" className={`${field} w-24`} defaultValue={last?.from !== undefined ? String(last.from) : "0.1"} required />
          </label>
          <label className="space-y-0.5 text-sm">
            <span className="block">to</span>
            <input name="to" className={`${field} w-24`} defaultValue={last?.to !== undefined ? String(last.to) : "10"} required />
          </label>
          <label className="space-y-0.5 text-sm">
            <span className="block">points</span>
            <input name="points" type="number" min={2} max={200} className={`${field} w-20`} defaultValue={last?.points ?? 30} />
          </label>
          <label className="space-y-0.5 text-sm">
            <span className="block">spacing</span>
            <select name="spacing" className={field} defaultValue={last?.spacing ?? "log"}>
              <option value="linear">linear</option>
              <option value="log">log</option>
            </select>
          </label>
        </StartForm>
      )}
      {!available && <p className="text-sm text-muted">Scans start from an analysis with numeric rate constants and initial concentrations.</p>}
      <ul className="space-y-2">
        {jobs.map((j) => {
          const p = j.params as { parameter?: { name: string }; from?: number; to?: number; spacing?: string; points?: number };
          return (
            <JobLine key={j.id} job={j} canEdit={canEdit}>
              <p className="text-sm">
                {p.parameter?.name} from {p.from} to {p.to}, {p.points} points ({p.spacing})
              </p>
              <ScanChart scan={j.result as unknown as ScanResult} csvHref={csvHref(j.id)} />
            </JobLine>
          );
        })}
      </ul>
    </div>
  );
}

export function TimeCoursePanel({
  jobs,
  canEdit,
  steadyStates,
  available,
  start = null,
}: {
  jobs: Child[];
  canEdit: boolean;
  steadyStates: StoredSteadyState[];
  available: boolean;
  /** The analysis' initial concentrations (the version's stored ones unless changed), filled in as the default start. */
  start?: Record<string, string> | null;
}) {
  const last = lastParams<TimeCourseParams>(jobs);
  return (
    <div className="space-y-3">
      {canEdit && available && (
        <StartForm key={jobs[0]?.id ?? "none"} intent="timecourse" label="Simulate">
          <label className="space-y-0.5 text-sm">
            <span className="block">End time</span>
            <input name="endTime" className={`${field} w-28`} defaultValue={last?.endTime !== undefined ? String(last.endTime) : "50"} />
          </label>
          <label className="flex-1 space-y-0.5 text-sm">
            <span className="block">Initial concentrations (filled in: the last run's, else the analysis' own)</span>
            <input
              name="initial"
              className={`${field} w-full font-mono`}
              placeholder="e.g. X=2.5"
              defaultValue={last?.initial ? Object.entries(last.initial).map(([k, v]) => `${k}=${v}`).join(",") : start ? Object.entries(start).map(([k, v]) => `${k}=${v}`).join(", ") : ""}
            />
          </label>
        </StartForm>
      )}
      {!available && <p className="text-sm text-muted">A time course needs numeric rate constants and initial concentrations.</p>}
      <ul className="space-y-2">
        {jobs.map((j) => (
          <JobLine key={j.id} job={j} canEdit={canEdit}>
            <p className="text-sm">
              Until t = {(j.params as { endTime?: number }).endTime}, from{" "}
              <span className="font-mono">{Object.entries((j.params as { initial?: Record<string, string> | null }).initial ?? {}).map(([k, v]) => `${k}=${v}`).join(", ") || "the analysis' initial concentrations"}</span>
            </p>
            <TimeCourseChart course={j.result as unknown as TimeCourseResult} steadyStates={steadyStates} />
          </JobLine>
        ))}
      </ul>
    </div>
  );
}
