import type { AnalysisStatus } from "~/db/schema";

const STYLE: Record<AnalysisStatus, string> = {
  queued: "bg-sunken text-muted",
  running: "bg-signal-soft text-signal",
  succeeded: "bg-ok-soft text-ok",
  failed: "bg-danger-soft text-danger",
  cancelled: "bg-sunken text-muted",
};

export function StatusBadge({ status }: { status: AnalysisStatus }) {
  return (
    <span className={`rounded-pill px-2 py-0.5 text-xs font-medium ${STYLE[status]}`} data-testid="status">
      {status}
    </span>
  );
}

export const isUnfinished = (s: AnalysisStatus) => s === "queued" || s === "running";

export function formatMs(ms: number | undefined): string {
  if (ms === undefined || !Number.isFinite(ms)) return "–";
  return ms < 10_000 ? `${(ms / 1000).toFixed(1)} s` : `${Math.round(ms / 1000)} s`;
}
