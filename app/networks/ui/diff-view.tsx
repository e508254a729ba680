import type { NetworkDiff } from "../diff";

/** Species and reactions added, removed and changed between two versions. */
export function DiffView({ diff }: { diff: NetworkDiff }) {
  if (diff.identical) return <p className="text-sm text-muted" data-testid="diff-identical">Same species, constant species and reactions in both versions.</p>;
  const rx = (r: { reactant: string; product: string; rate: string; rateValue?: string; held?: Record<string, number> }) =>
    `${r.reactant} → ${r.product}  (${r.rate}${r.rateValue ? ` = ${r.rateValue}` : ""}${r.held ? `, times constant ${Object.entries(r.held).map(([s, c]) => (c === 1 ? s : `${s}^${c}`)).join("·")}` : ""})`;
  return (
    <div className="grid grid-cols-1 gap-4 md:grid-cols-2" data-testid="diff">
      <Group title="Species added" tone="ok" items={diff.speciesAdded} testId="species-added" />
      <Group title="Species removed" tone="danger" items={diff.speciesRemoved} testId="species-removed" />
      <Group title="Reactions added" tone="ok" items={diff.reactionsAdded.map(rx)} testId="reactions-added" />
      <Group title="Reactions removed" tone="danger" items={diff.reactionsRemoved.map(rx)} testId="reactions-removed" />
      <div className="md:col-span-2">
        <Group title="Reactions changed" tone="signal" items={diff.reactionsChanged.map((c) => `${c.reaction}: ${c.changes.join("; ")}`)} testId="reactions-changed" />
      </div>
      {(diff.constantsChanged ?? []).length > 0 ? (
        <div className="md:col-span-2">
          <Group title="Constant species" tone="signal" items={diff.constantsChanged} testId="constants-changed" />
        </div>
      ) : null}
      {(diff.initialChanged ?? []).length > 0 ? (
        <div className="md:col-span-2">
          <Group title="Initial values" tone="signal" items={diff.initialChanged} testId="initial-changed" />
        </div>
      ) : null}
    </div>
  );
}

function Group({ title, items, tone, testId }: { title: string; items: string[]; tone: "ok" | "danger" | "signal"; testId: string }) {
  const mark = tone === "ok" ? "+" : tone === "danger" ? "−" : "~";
  const colour = tone === "ok" ? "text-ok bg-ok-soft" : tone === "danger" ? "text-danger bg-danger-soft" : "text-signal bg-signal-soft";
  return (
    <div className="rounded-md border border-line bg-surface p-3">
      <h3 className="mb-1 text-sm font-semibold">
        {title} <span className="font-normal text-muted">({items.length})</span>
      </h3>
      {items.length === 0 ? (
        <p className="text-sm text-faint">none</p>
      ) : (
        <ul className="space-y-1 font-mono text-sm" data-testid={testId}>
          {items.map((item, i) => (
            <li key={i} className={`rounded-sm px-2 py-0.5 ${colour}`}>
              {mark} {item}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
