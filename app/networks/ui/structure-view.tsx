import type { NetworkStructure, TheoremVerdict } from "@domain/network/index";
import { lawsAsEquations } from "../conservation-text";
import { GLOSSARY } from "../glossary";
import { layoutComplexGraph } from "../graph-layout";
import type { SpeciesOde } from "@domain/steady-state/ode-terms";
import { speciesRoles } from "../species-roles";
import { ComplexGraph, classColour } from "./complex-graph";
import { OdesView } from "./odes-view";
import { Fact, Help, Section } from "./section";

const th = "px-3 py-1.5 text-left text-xs font-medium uppercase tracking-wide text-muted";
const td = "px-3 py-1.5 align-top";

/** The evidence under the verdict card, in reading order: id and title of each part. */
export const EVIDENCE = [
  ["reactions", "Reactions and species"],
  ["theorems", "Theorems checked"],
  ["conservation", "Conserved totals"],
  ["connections", "How complexes connect"],
  ["counting", "The count behind δ"],
  ["stoichiometric-matrix", "Stoichiometric matrix"],
  ["odes", "Rate equations"],
] as const;

/** The numbers a modeller checks first, for the side column. */
export function AtAGlance({ structure: s }: { structure: NetworkStructure }) {
  return (
    <dl className="text-sm" aria-label="At a glance">
      <Fact label="Species" value={s.species.length} testId="stat-species" />
      <Fact label="Reactions" value={s.reactions} testId="stat-reactions" />
      <Fact label="Complexes" symbol="n" value={s.complexes.length} testId="stat-complexes" />
      <Fact label="Linkage classes" symbol="ℓ" value={s.linkageClasses} testId="stat-linkage" />
      <Fact label="Rank" symbol="s" value={s.rank} testId="stat-rank" />
      <Fact label="Deficiency" symbol="δ" value={s.deficiency} testId="stat-deficiency" />
      <Fact label="Weakly reversible" value={s.weaklyReversible ? "yes" : "no"} testId="stat-weakly-reversible" />
    </dl>
  );
}

/** Everything the structure of one version says, as evidence for the verdict, each part with its help. */
export function StructureView({ structure, odes, name }: { structure: NetworkStructure; odes: readonly SpeciesOde[]; name: string }) {
  const s = structure;
  const laws = s.minimalSemiPositiveConservationLaws ?? s.conservationLaws;
  const layout = layoutComplexGraph(s);
  const title = Object.fromEntries(EVIDENCE) as Record<(typeof EVIDENCE)[number][0], string>;
  return (
    <div className="space-y-8" data-testid="structure">
      {s.warnings.length > 0 && (
        <ul className="rounded-md bg-signal-soft px-4 py-2 text-sm text-signal">
          {s.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}

      <Section id="reactions" title={title.reactions} help={GLOSSARY.reactions}>
        <div className="overflow-x-auto rounded-md border border-line bg-surface">
          <table className="w-full text-sm" data-testid="reactions-table">
            <thead className="border-b border-line bg-sunken">
              <tr>
                <th className={th}>#</th>
                <th className={th}>Reaction</th>
                <th className={th}>Rate constant</th>
                <th className={th}>Value</th>
                <th className={th}>Label</th>
                <th className={th}>File line</th>
              </tr>
            </thead>
            <tbody>
              {s.reactionList.map((r) => (
                <tr key={r.id} className="border-b border-line last:border-0">
                  <td className={`${td} text-muted`}>{r.id}</td>
                  <td className={`${td} font-mono`}>
                    {r.reactant} → {r.product}
                  </td>
                  <td className={`${td} font-mono`}>{r.rate}</td>
                  <td className={`${td} font-mono`}>{r.rateValue ?? <span className="text-faint">symbolic</span>}</td>
                  <td className={td}>{r.label ?? ""}</td>
                  <td className={`${td} text-muted`}>{r.row}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        <h3 id="species" className="pt-2 font-semibold">Species</h3>
        <Help text={GLOSSARY.species} title="Species" />
        <div className="overflow-x-auto rounded-md border border-line bg-surface">
          <table className="w-full text-sm" data-testid="species-table">
            <thead className="border-b border-line bg-sunken">
              <tr>
                <th className={th}>Species</th>
                <th className={th} title="Reactions that increase the species on balance">
                  Made by
                </th>
                <th className={th} title="Reactions with the species among their reactants, also when they make more of it">
                  Used by
                </th>
                <th className={th}>In conservation laws</th>
              </tr>
            </thead>
            <tbody>
              {speciesRoles(s).map(({ species: sp, madeBy: made, usedBy: used }) => {
                const inLaws = laws.map((l, k) => (l[sp] ? k + 1 : 0)).filter(Boolean);
                return (
                  <tr key={sp} className="border-b border-line last:border-0">
                    <td className={`${td} font-mono font-medium`}>{sp}</td>
                    <td className={`${td} text-muted`}>{made.join(", ") || "—"}</td>
                    <td className={`${td} text-muted`}>{used.join(", ") || "—"}</td>
                    <td className={`${td} text-muted`}>{inLaws.length ? inLaws.map((k) => `law ${k}`).join(", ") : "—"}</td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
        {(s.constants ?? []).length > 0 && (
          <p className="mt-2 text-sm text-muted" data-testid="constant-species">
            Held constant (not variables; their concentrations multiply the rate constants of the reactions that consume them, and they are left out of the complexes and matrices):{" "}
            {(s.constants ?? []).map((c, k) => (
              <span key={c.name}>
                {k > 0 ? ", " : ""}
                <span className="font-mono text-ink">{c.name}</span> {c.value ? `= ${c.value}` : "(symbolic)"}
              </span>
            ))}
            .
          </p>
        )}
      </Section>

      <Section id="theorems" title={title.theorems} help={GLOSSARY.theorems}>
        <div className="grid gap-3 xl:grid-cols-2">
          <div id="deficiency-zero" className="space-y-2">
            <h3 className="font-semibold">Deficiency zero theorem</h3>
            <Help text={GLOSSARY.deficiencyZero} title="Deficiency zero theorem" />
            <VerdictView verdict={s.deficiencyZeroTheorem} testId="deficiency-zero" />
          </div>
          <div id="deficiency-one" className="space-y-2">
            <h3 className="font-semibold">Deficiency one theorem</h3>
            <Help text={GLOSSARY.deficiencyOne} title="Deficiency one theorem" />
            <VerdictView verdict={s.deficiencyOneTheorem} testId="deficiency-one" />
          </div>
        </div>
      </Section>

      <Section id="conservation" title={title.conservation} help={GLOSSARY.conservation}>
        {laws.length === 0 ? (
          <p className="text-sm" data-testid="conservation-laws">
            None: no weighted sum of concentrations is kept constant by every reaction.
          </p>
        ) : (
          <ul className="space-y-1 font-mono" data-testid="conservation-laws">
            {lawsAsEquations(laws, s.species).map((eq) => (
              <li key={eq}>{eq}</li>
            ))}
          </ul>
        )}
        <p className="text-sm text-muted">
          {s.species.length} species − rank {s.rank} = {s.species.length - s.rank} independent law{s.species.length - s.rank === 1 ? "" : "s"}
          {s.minimalSemiPositiveConservationLaws ? "; shown are the minimal ones with non-negative weights" : ""}.
          {s.conservative === true ? " Every species is covered by a positive law, so no concentration can grow without bound." : ""}
        </p>
      </Section>

      <Section id="connections" title={title.connections} help={GLOSSARY.graph}>
        <div id="graph" className="overflow-x-auto rounded-md border border-line bg-surface p-3">
          <ComplexGraph layout={layout} title={`Complex graph of ${name}: ${s.complexes.length} complexes in ${s.linkageClasses} linkage classes`} />
        </div>
        <h3 id="complexes" className="pt-2 font-semibold">Complexes by linkage class</h3>
        <Help text={GLOSSARY.complexes + " " + GLOSSARY.linkageClasses} title="Complexes and linkage classes" />
        <ol className="space-y-2 text-sm" data-testid="linkage-classes">
          {s.linkageClassMembers.map((members, k) => (
            <li key={k} className="rounded-md border-l-4 bg-surface px-3 py-2" style={{ borderColor: classColour(k) }}>
              <span className="font-medium">Linkage class {k + 1}</span>
              <span className="text-muted"> · deficiency {s.linkageClassDeficiencies[k]}</span>
              <div className="mt-1 flex flex-wrap gap-1.5 font-mono">
                {members.map((c) => (
                  <span key={c} className="rounded-sm border border-line px-1.5">
                    {c}
                  </span>
                ))}
              </div>
            </li>
          ))}
        </ol>
        <p className="text-sm text-muted">
          Strong linkage classes: {s.strongLinkageClasses.map((c) => `{${c.join(", ")}}`).join(" ")}. Terminal:{" "}
          {s.terminalStrongLinkageClasses.map((c) => `{${c.join(", ")}}`).join(" ")}.
        </p>
      </Section>

      <Section id="counting" title={title.counting} help={GLOSSARY.rank + " " + GLOSSARY.deficiency}>
        <p className="font-mono text-base" data-testid="deficiency-formula">
          δ = n − ℓ − s = {s.complexes.length} − {s.linkageClasses} − {s.rank} = {s.deficiency}
        </p>
        <p className="text-sm">
          The reactions allow {s.rank} independent direction{s.rank === 1 ? "" : "s"} of change among {s.species.length} species.
        </p>
        <h3 id="weak-reversibility" className="pt-2 font-semibold">Weak reversibility</h3>
        <Help text={GLOSSARY.weakReversibility} title="Weak reversibility" />
        <p className="text-sm" data-testid="weak-reversibility">
          {s.weaklyReversible
            ? s.reversible
              ? "Weakly reversible: in fact every reaction has its reverse."
              : "Weakly reversible: every reaction lies on a cycle of reactions."
            : "Not weakly reversible: some reaction cannot be undone by any chain of reactions (look for strong linkage classes with arrows leaving them)."}
        </p>
      </Section>

      <Section id="stoichiometric-matrix" title={title["stoichiometric-matrix"]} help={GLOSSARY.stoichiometricMatrix}>
        <div className="overflow-x-auto">
          <table className="border-collapse font-mono text-sm" data-testid="stoichiometric-matrix">
            <thead>
              <tr>
                <th className="px-2 py-1" />
                {s.reactionList.map((r) => (
                  <th key={r.id} className="px-2 py-1 text-center text-xs font-medium text-muted" title={`${r.reactant} → ${r.product}`}>
                    {r.id}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {s.species.map((sp, i) => (
                <tr key={sp}>
                  <th className="px-2 py-1 text-right font-medium">{sp}</th>
                  {s.stoichiometricMatrix[i]!.map((v, j) => (
                    <td
                      key={j}
                      className={`min-w-10 border border-line px-2 py-1 text-center tabular-nums ${v > 0 ? "bg-ok-soft text-ok" : v < 0 ? "bg-danger-soft text-danger" : "text-faint"}`}
                    >
                      {v > 0 ? `+${v}` : v < 0 ? `−${-v}` : "0"}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Section>

      <OdesSection odes={odes} />
    </div>
  );
}

/** The rate equations: from the file alone, so the page shows them also while the structure is pending. */
export function OdesSection({ odes }: { odes: readonly SpeciesOde[] }) {
  return (
    <Section id="odes" title={EVIDENCE.find(([id]) => id === "odes")![1]} help={GLOSSARY.odes}>
      <OdesView odes={odes} />
    </Section>
  );
}

/** A theorem's verdict: whether it applies and why, its conclusions, its assumptions, its sources. */
function VerdictView({ verdict, testId }: { verdict: TheoremVerdict; testId: string }) {
  return (
    <div className={`rounded-md px-4 py-3 text-sm ${verdict.applies ? "bg-ok-soft" : "bg-sunken"}`} data-testid={testId}>
      <p className="font-medium">
        {verdict.applies ? "Applies." : "Does not decide this network."} {verdict.reason}
      </p>
      {verdict.conclusions.length > 0 && (
        <>
          <p className="mt-2 font-medium">Conclusions</p>
          <ul className="list-disc pl-5">
            {verdict.conclusions.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </>
      )}
      {verdict.assumptions.length > 0 && (
        <>
          <p className="mt-2 font-medium">Under these assumptions</p>
          <ul className="list-disc pl-5">
            {verdict.assumptions.map((a) => (
              <li key={a}>{a}</li>
            ))}
          </ul>
        </>
      )}
      <p className="mt-2 text-xs text-muted">Sources: {verdict.sources.join("; ")}.</p>
    </div>
  );
}
