import { usePolling } from "~/analyses/ui/use-polling";

/**
 * In place of a structure the worker has not computed yet: says so, and reloads the page's data
 * every second until it is there (the web server never computes it itself). A failed computation
 * says why and stops polling.
 */
export function StructurePending({ status, problem, what = "The structure of this version" }: { status: "pending" | "failed"; problem?: string; what?: string }) {
  usePolling(status === "pending", 1000);
  if (status === "failed") {
    return (
      <p role="alert" className="rounded-md border border-line bg-surface px-4 py-3 text-sm" data-testid="structure-failed">
        {what} could not be computed: {problem ?? "unknown reason"}.
      </p>
    );
  }
  return (
    <p role="status" aria-live="polite" className="rounded-md border border-line bg-surface px-4 py-3 text-sm text-muted" data-testid="structure-pending">
      {what} is being computed in the background; this page fills in by itself in a moment.
    </p>
  );
}
