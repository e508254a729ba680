import type { VerdictCard, VerdictTone } from "../verdict";

const TONE: Record<VerdictTone, string> = {
  settled: "border-ok bg-ok-soft",
  none: "border-danger bg-danger-soft",
  open: "border-line-strong bg-sunken",
};
const MARK: Record<VerdictTone, string> = { settled: "Decided", none: "Decided", open: "Open" };

/** What the network can do, first: three answers, each with its basis, then what they all assume. */
export function VerdictCardView({ card }: { card: VerdictCard }) {
  return (
    <section aria-labelledby="verdict-title" className="rounded-card border border-line bg-surface p-4 sm:p-5" data-testid="verdict-card">
      <h2 id="verdict-title" className="text-lg font-semibold tracking-tight">
        What this network can do
      </h2>
      <ul className="mt-3 grid gap-3 md:grid-cols-3">
        {card.lines.map((line) => (
          <li key={line.key} className={`flex flex-col rounded-md border-l-4 px-4 py-3 ${TONE[line.tone]}`} data-testid={`verdict-${line.key}`}>
            <p className="flex items-baseline justify-between gap-2 text-xs font-semibold uppercase tracking-wide text-muted">
              <span>{line.label}</span>
              <span className="font-normal normal-case">{MARK[line.tone]}</span>
            </p>
            <p className="mt-1 font-medium text-ink" data-testid={`verdict-${line.key}-statement`}>
              {line.statement}
            </p>
            <p className="mt-1 flex-1 text-sm text-muted">{line.basis}</p>
            <a href={line.evidence.href} className="mt-2 self-start text-sm text-accent-strong hover:underline">
              {line.evidence.label} →
            </a>
          </li>
        ))}
      </ul>
      <div className="mt-3 flex flex-wrap items-center gap-1.5 text-xs" data-testid="verdict-assumptions">
        <span className="font-medium text-muted">Assumes:</span>
        {card.assumptions.map((a) => (
          <span key={a} className="rounded-pill border border-line px-2 py-0.5 text-muted">
            {a}
          </span>
        ))}
      </div>
    </section>
  );
}
