/** A page section with its plain-language help beside it (below it on narrow screens). */
export function Section({ id, title, help, children }: { id: string; title: string; help: string; children: React.ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="grid grid-cols-1 gap-4 border-t border-line pt-6 lg:grid-cols-[minmax(0,1fr)_18rem]">
      <div className="min-w-0 space-y-3">
        <h2 id={`${id}-title`} className="text-lg font-semibold tracking-tight">
          {title}
        </h2>
        {children}
      </div>
      <aside className="self-start rounded-md bg-sunken px-4 py-3 text-sm leading-relaxed text-muted" aria-label={`About ${title.toLowerCase()}`}>
        <p className="mb-1 text-xs font-semibold uppercase tracking-wide text-faint">What this means</p>
        {renderCode(help)}
      </aside>
    </section>
  );
}

/** Backticked bits of help text as <code>. */
function renderCode(text: string) {
  return text.split(/(`[^`]+`)/).map((part, i) =>
    part.startsWith("`") ? (
      <code key={i} className="rounded-sm bg-surface px-1 text-ink">
        {part.slice(1, -1)}
      </code>
    ) : (
      part
    ),
  );
}

export function Stat({ label, symbol, value, testId }: { label: string; symbol?: string; value: React.ReactNode; testId?: string }) {
  return (
    <div className="rounded-md border border-line bg-surface px-4 py-3">
      <dt className="text-xs uppercase tracking-wide text-muted">
        {label}
        {/* Upper-casing would turn δ into Δ, a different symbol. */}
        {symbol && <span className="ml-1 font-serif text-sm normal-case italic">{symbol}</span>}
      </dt>
      <dd className="mt-1 text-xl font-semibold tabular-nums" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}
