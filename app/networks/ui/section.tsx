/**
 * One part of the evidence under the verdict card: a title, the content, and its plain-language
 * help folded away under "What this means" (open it when the term is new).
 */
export function Section({ id, title, help, children }: { id: string; title: string; help: string; children: React.ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="min-w-0 scroll-mt-4 space-y-3 border-t border-line pt-5">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <h2 id={`${id}-title`} className="text-lg font-semibold tracking-tight">
          {title}
        </h2>
      </div>
      <Help text={help} title={title} />
      {children}
    </section>
  );
}

export function Help({ text, title }: { text: string; title: string }) {
  return (
    <details className="group text-sm">
      <summary className="cursor-pointer select-none text-accent-strong hover:underline" aria-label={`What ${title.toLowerCase()} means`}>
        What this means
      </summary>
      <p className="mt-1 max-w-prose rounded-md bg-sunken px-3 py-2 leading-relaxed text-muted">{renderCode(text)}</p>
    </details>
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

/** A fact of the at-a-glance list: label left, value right. */
export function Fact({ label, symbol, value, testId }: { label: string; symbol?: string; value: React.ReactNode; testId?: string }) {
  return (
    <div className="flex items-baseline justify-between gap-3 border-b border-line py-1 last:border-0">
      <dt className="text-muted">
        {label}
        {symbol && <span className="ml-1 font-serif italic">{symbol}</span>}
      </dt>
      <dd className="font-semibold tabular-nums" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}
