import type { DistributedRunView } from "~/analyses/distributed-runs.server";

/** Bases over Q this analysis spread over the workers: images done/needed, primes, who took part. */
export function DistributedRuns({ runs }: { runs: DistributedRunView[] }) {
  if (runs.length === 0) return null;
  return (
    <section className="rounded-md border border-line bg-surface px-4 py-3 text-sm" data-testid="distributed-runs">
      <h2 className="font-medium">Bases computed on several workers</h2>
      <ul className="mt-1 space-y-1">
        {runs.map((r) => (
          <li key={r.id} data-testid="distributed-run">
            <span className="tabular-nums">
              {r.imagesDone} image{r.imagesDone === 1 ? "" : "s"} done of {r.imagesNeeded ?? `at least ${r.imagesDone + 1}`} needed
            </span>
            {r.proofBatches > 0 && <span className="tabular-nums">; proof {r.proofDone} of {r.proofBatches} batches</span>}
            <span> · {runStatus(r)}</span>
            <span className="text-muted">
              {" "}· {r.workerCount} worker{r.workerCount === 1 ? "" : "s"}
              {r.workers.length > 0 ? `: ${r.workers.join(", ")}` : ""}
            </span>
            {r.primesUsed.length > 0 && (
              <span className="block text-xs text-muted">
                {r.primesUsed.length} primes lifted{r.unluckyPrimes.length > 0 ? `, ${r.unluckyPrimes.length} set aside as unlucky` : ""}
                {r.declinedPrimes.length > 0 ? `, ${r.declinedPrimes.length} set aside where the replayed F4 run declined` : ""}; engine {r.engineVersion}
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function runStatus(r: DistributedRunView): string {
  if (r.status === "succeeded") return "proven";
  if (r.status === "running") return "running";
  if (r.status === "failed") return `not used: ${r.error ?? "failed"}; ${r.insteadBy === "later run" ? "its homogenised ideal was spread instead (next line)" : "computed in one process instead"}`;
  return `stopped (${r.error ?? "cancelled"})`;
}
