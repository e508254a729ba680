import { stageLabel } from "../stages";
import { SteadyStatesTable } from "./steady-states-table";
import type { ResultView } from "~/analyses/present";
import type { MultistationarityJson } from "@domain/steady-state/result";
import type { AnalysisResult } from "~/analyses/result-types";
import { answerOf, type Answer } from "~/analyses/answer";
import { ParametrisationTable } from "./parametrisation-table";
import { Formula } from "./tex";

function Block({ id, title, children }: { id: string; title: string; children: React.ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-title`} className="space-y-3 border-t border-line pt-5">
      <h2 id={`${id}-title`} className="text-lg font-semibold tracking-tight">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** The assumptions every result below rests on, stated once beside the results. */
export function Assumptions({ numeric }: { numeric: boolean }) {
  return (
    <aside className="rounded-md bg-sunken px-4 py-3 text-sm leading-relaxed text-muted" data-testid="assumptions">
      <p className="mb-1 text-xs font-semibold uppercase tracking-wide text-faint">Assumptions</p>
      <ul className="ml-4 list-disc">
        <li>Mass-action kinetics: each reaction's rate is its rate constant times the product of its reactant concentrations.</li>
        <li>Only positive steady states: every concentration is strictly positive (solutions with a zero concentration are removed by saturation).</li>
        {numeric ? (
          <li>Numeric rate constants and totals as given, read as exact fractions; eigenvalues and concentrations are then floating-point (12 digits).</li>
        ) : (
          <li>Symbolic rate constants and totals are generic: results hold except where the listed leading coefficients vanish.</li>
        )}
        <li>Stability is judged on the stoichiometric compatibility class (eigenvalues of the Jacobian restricted to the stoichiometric subspace).</li>
      </ul>
    </aside>
  );
}

/** The result's answer in one sentence, before the evidence. */
function AnswerCard({ answer }: { answer: Answer }) {
  const tone = answer.tone === "none" ? "border-danger" : answer.tone === "states" ? "border-ok" : "border-line";
  return (
    <section aria-label="Answer" className={`rounded-card border-l-4 ${tone} bg-surface px-5 py-4`} data-testid="answer">
      <p className="text-lg font-semibold" data-testid="answer-headline">{answer.headline}</p>
      {answer.details.map((d, i) => (
        <p key={i} className="mt-1 text-sm text-muted">
          {d}
        </p>
      ))}
    </section>
  );
}

export function ResultsView({ view, result }: { view: ResultView; result: AnalysisResult }) {
  return (
    <div className="space-y-6" data-testid="results">
      <AnswerCard answer={answerOf(result)} />
      {!view.typeset && (
        <p className="rounded-md bg-sunken px-4 py-2 text-sm text-muted" data-testid="untypeset-note">
          This result was stored by an older engine version, which kept its formulas as text only: they are shown as text, and the parametrisation's degrees were not recorded.
        </p>
      )}
      <Block id="triangular" title="Triangular system (lex Gröbner basis)">
        <p className="text-sm text-muted">
          Ring order {result.ordering}. {result.groebnerBasisComplete
            ? `${result.groebnerBasis.length} polynomials, grouped by leading species.`
            : result.groebnerBasisStatus === "skipped"
              ? "Not computed: the parametrisation below already describes every positive steady state."
              : "Not finished within the budget (see the notes)."}
        </p>
        {view.triangular.map((b, i) => (
          <div key={i} className="rounded-md border border-line bg-surface px-4 py-2">
            <p className="text-xs uppercase tracking-wide text-faint">{b.species === null ? "parameters only" : `leading species ${b.species}`}</p>
            {b.text.map((text, j) => (
              <div key={j} data-testid="triangular-polynomial" title={text}>
                <Formula tex={b.tex?.[j] ?? null} text={`${text} = 0`} display />
              </div>
            ))}
          </div>
        ))}
        {result.genericConditions.length > 0 && (
          <p className="text-sm">
            Valid for generic parameters; these leading coefficients must not vanish: <span className="font-mono">{result.genericConditions.join("; ")}</span>
          </p>
        )}
      </Block>
      <Block id="parametrisation" title="Parametrisation of the positive steady states">
        {view.parametrisation ? (
          <>
            <p className="text-sm">
              Free: <span className="font-mono">{view.parametrisation.free.join(", ") || "(none)"}</span>.{" "}
              {view.parametrisation.positive ? <b className="text-ok">Positive parametrisation: every coefficient is positive.</b> : "Not every coefficient is positive."}
              {result.nonVanishing.length > 0 && <> Valid where these do not vanish: <span className="font-mono">{result.nonVanishing.join("; ")}</span>.</>}
            </p>
            <ParametrisationTable rows={view.parametrisation.rows} />
          </>
        ) : result.rootsNeeded.length > 0 ? (
          <ul className="text-sm">
            {result.rootsNeeded.map((r) => (
              <li key={r.species}>
                <span className="font-mono">{r.species}</span> needs a root of a degree-{r.degree} polynomial: <span className="font-mono">{r.polynomial} = 0</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-sm text-muted">No rational parametrisation was found.</p>
        )}
      </Block>
      <Block id="conservation" title="Conservation laws and totals">
        {view.conservation.length === 0 ? (
          <p className="text-sm text-muted">None: the stoichiometric matrix has full row rank.</p>
        ) : (
          <ul className="space-y-1 font-mono text-sm" data-testid="conservation">
            {view.conservation.map((c, i) => (
              <li key={i}>
                {c.text} = {c.total ?? `T${i + 1}`}
              </li>
            ))}
          </ul>
        )}
      </Block>
      <Block id="acr" title="Absolute concentration robustness">
        {view.acr.length === 0 ? (
          <p className="text-sm text-muted">No species has the same value at every positive steady state for every choice of totals.</p>
        ) : (
          <ul data-testid="acr">
            {view.acr.map((a) => (
              <li key={a.species}>
                <Formula tex={a.tex} text={`${a.species} = ${a.value}`} /> at every positive steady state
              </li>
            ))}
          </ul>
        )}
      </Block>
      {view.steadyStates && (
        <Block id="steady-states" title={`Positive steady states in this class (${view.steadyStates.length})`}>
          {result.eliminant && (
            <p className="text-sm text-muted">
              From the real roots of <span className="font-mono">{result.eliminant.polynomial}</span> in {result.eliminant.variable}, isolated exactly.
            </p>
          )}
          <SteadyStatesTable states={view.steadyStates} species={view.species} />
        </Block>
      )}
      {result.steadyStates === null && (result.steadyStateSet === "continuum" || result.steadyStatesReason) && (
        <p className="text-sm" data-testid="steady-states-reason">
          {result.steadyStatesReason ?? "The steady states of this class form a continuum; none are listed."}
        </p>
      )}
      {(result.unfinished ?? []).length > 0 && (
        <Block id="unfinished" title="Unfinished stages">
          <p className="text-sm text-muted">These stages ran out of time or size, or were not reached before the run stopped; everything else shown was finished.</p>
          <ul className="ml-5 list-disc space-y-1 text-sm" data-testid="unfinished">
            {result.unfinished!.map((u, i) => (
              <li key={i}>
                <span className="font-medium">{stageLabel(u.stage)}</span>: {u.reason}
              </li>
            ))}
          </ul>
        </Block>
      )}
      {result.multistationarity && (
        <Block id="multistationarity" title="Can this network be multistationary?">
          <Multistationarity m={result.multistationarity} />
        </Block>
      )}
      <Block id="notes" title="Notes and warnings">
        <ul className="ml-5 list-disc space-y-1 text-sm text-muted" data-testid="warnings">
          {result.warnings.map((w, i) => (
            <li key={i}>{w}</li>
          ))}
        </ul>
      </Block>
    </div>
  );
}

const VERDICT_TEXT: Record<MultistationarityJson["verdict"], string> = {
  multistationary: "Yes: for some positive rate constants and totals there are two or more positive steady states in one class.",
  monostationary: "No: for every choice of positive rate constants and totals each class holds at most one positive steady state.",
  undecided: "Undecided: no criterion applied and no witness was found.",
};

/** The verdict for "some constants" (not the constants of this run), with its method, witness and assumptions. */
function Multistationarity({ m }: { m: MultistationarityJson }) {
  return (
    <div className="space-y-2 text-sm" data-testid="multistationarity">
      <p>
        <b data-testid="multistationarity-verdict" className={m.verdict === "multistationary" ? "text-signal" : m.verdict === "monostationary" ? "text-ok" : "text-muted"}>
          {m.verdict}
        </b>{" "}
        — {VERDICT_TEXT[m.verdict]}
      </p>
      <p className="text-muted">
        Method: {m.method}. {m.reason}
      </p>
      {m.witness && (
        <div className="space-y-1" data-testid="multistationarity-witness">
          <p>
            Witness (exact values): rate constants <span className="font-mono">{Object.entries(m.witness.rates).map(([k, v]) => `${k} = ${v}`).join(", ")}</span>
            {Object.keys(m.witness.totals).length > 0 && (
              <>
                ; totals <span className="font-mono">{Object.entries(m.witness.totals).map(([k, v]) => `${k} = ${v}`).join(", ")}</span>
              </>
            )}
            ; e.g. from the initial state <span className="font-mono">{Object.entries(m.witness.initial).map(([k, v]) => `${k} = ${v}`).join(", ")}</span>.
          </p>
          <div className="overflow-x-auto rounded-card border border-line bg-surface">
            <table className="w-full text-left text-sm">
              <thead className="border-b border-line bg-sunken text-xs uppercase tracking-wide text-muted">
                <tr>
                  <th className="px-3 py-2">#</th>
                  {Object.keys(m.witness.steadyStates[0] ?? {}).map((s) => (
                    <th key={s} className="px-3 py-2 font-mono normal-case">
                      {s}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {m.witness.steadyStates.map((st, i) => (
                  <tr key={i} className="border-b border-line last:border-0">
                    <td className="px-3 py-2 tabular-nums">{i + 1}</td>
                    {Object.values(st).map((v, j) => (
                      <td key={j} className="px-3 py-2 tabular-nums">
                        {v.toPrecision(10)}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      )}
      {m.assumptions && (
        <ul className="ml-5 list-disc text-xs text-muted" data-testid="multistationarity-assumptions">
          {m.assumptions.map((a, i) => (
            <li key={i}>{a}</li>
          ))}
        </ul>
      )}
      {m.sources && m.sources.length > 0 && <p className="text-xs text-faint">Sources: {m.sources.join("; ")}.</p>}
    </div>
  );
}
