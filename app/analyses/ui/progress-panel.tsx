import { useFetcher } from "react-router";
import type { JobJson } from "~/analyses/repository.server";
import { formatMs, isUnfinished } from "./status";

interface Progress {
  stage?: string;
  message?: string;
  elapsedMs?: number;
  basisSize?: number;
  pairsLeft?: number;
}

/** Live progress of an unfinished job (the page revalidates every second) with a cancel button for editors. */
export function ProgressPanel({ job, canCancel }: { job: JobJson; canCancel: boolean }) {
  const fetcher = useFetcher();
  const p = job.progress as Progress;
  if (!isUnfinished(job.status)) return null;
  return (
    <div className="flex flex-wrap items-center gap-x-6 gap-y-2 rounded-md border border-signal bg-signal-soft px-4 py-3 text-sm" data-testid="progress" aria-live="polite">
      <span className="font-medium">{job.status === "queued" ? "Waiting for a worker…" : "Computing…"}</span>
      <span>
        stage <b data-testid="progress-stage">{p.stage ?? "–"}</b>
      </span>
      {p.basisSize !== undefined && (
        <span>
          basis <b className="tabular-nums">{p.basisSize}</b> polynomials, <b className="tabular-nums">{p.pairsLeft ?? "?"}</b> pairs left
        </span>
      )}
      <span>
        elapsed <b className="tabular-nums">{formatMs(p.elapsedMs)}</b> of {job.timeLimitSeconds} s
      </span>
      {p.message && <span className="basis-full text-xs text-muted">{p.message}</span>}
      {canCancel && (
        <fetcher.Form method="post" className="ml-auto">
          <input type="hidden" name="intent" value="cancel" />
          <input type="hidden" name="jobId" value={job.id} />
          <button type="submit" disabled={job.cancelRequested || fetcher.state !== "idle"} className="rounded-md border border-danger bg-surface px-3 py-1 text-danger hover:bg-danger-soft disabled:opacity-60">
            {job.cancelRequested ? "Cancelling…" : "Cancel"}
          </button>
        </fetcher.Form>
      )}
    </div>
  );
}
