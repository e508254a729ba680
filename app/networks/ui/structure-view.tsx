import type { NetworkStructure, TheoremVerdict } from "@domain/network/index";
import { lawsAsEquations } from "../conservation-text";
import { GLOSSARY } from "../glossary";
import { layoutComplexGraph } from "../graph-layout";
import type { SpeciesOde } from "@domain/steady-state/ode-terms";
import { ComplexGraph, classColour } from "./complex-graph";
import { speciesRoles } from "../species-roles";
import { OdesView } from "./odes-view";
import { Section, Stat } from "./section";

const th = "px-3 py-1.5 text-left text-xs font-medium uppercase tracking-wide text-muted";
const td = "px-3 py-1.5 align-top";

/** Everything the structure of one version says, each part with its help. */
export function StructureView({ structure, odes, name }: { structure: NetworkStructure; odes: readonly SpeciesOde[]; name: string }) {
  const s = structure;
  const laws = s.minimalSemiPositiveConservationLaws ?? s.conservationLaws;
  const layout = layoutComplexGraph(s);
  const classOfComplex = new Map<string, number>();
  s.linkageClassMembers.forEach((m, k) => m.forEach((c) => classOfComplex.set(c, k)));
  const dz = s.deficiencyZeroTheorem;
  return (
    <div className="space-y-8" data-testid="structure">
      <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4 lg:grid-cols-7">
        <Stat label="Species" value={s.species.length} testId="stat-species" />
        <Stat label="Complexes" symbol="n" value={s.complexes.length} testId="stat-complexes" />
        <Stat label="Reactions" value={s.reactions} testId="stat-reactions" />
        <Stat label="Rank" symbol="s" value={s.rank} testId="stat-rank" />
        <Stat label="Linkage classes" symbol="ℓ" value={s.linkageClasses} testId="stat-linkage" />
        <Stat label="Deficiency" symbol="δ" value={s.deficiency} testId="stat-deficiency" />
        <Stat label="Weakly reversible" value={s.weaklyReversible ? "yes" : "no"} testId="stat-weakly-reversible" />
      </dl>
      {s.warnings.length > 0 && (
        <ul className="rounded-md bg-signal-soft px-4 py-2 text-sm text-signal">
          {s.warnings.map((w) => (
            <li key={w}>{w}</li>
          ))}
        </ul>
      )}

      <Section id="reactions" title="Reactions" help={GLOSSARY.reactions}>
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
                  <td className={`${td} whitespace-nowrap font-mono`}>
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
      </Section>

      <Section id="species" title="Species" help={GLOSSARY.species}>
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
        {(s.initial ?? []).length > 0 && (
          <p className="mt-2 text-sm text-muted" data-testid="stored-initial">
            Initial values stored with this version (the default start of analyses and time courses):{" "}
            <span className="font-mono text-ink">{(s.initial ?? []).map((i) => `${i.name} = ${i.value}`).join(", ")}</span>.
          </p>
        )}
      </Section>

      <Section id="stoichiometric-matrix" title="Stoichiometric matrix" help={GLOSSARY.stoichiometricMatrix}>
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

      <Section id="complexes" title="Complexes and linkage classes" help={GLOSSARY.complexes + " " + GLOSSARY.linkageClasses}>
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

      <Section id="graph" title="Complex graph" help={GLOSSARY.graph}>
        <div className="overflow-x-auto rounded-md border border-line bg-surface p-3">
          <ComplexGraph layout={layout} title={`Complex graph of ${name}: ${s.complexes.length} complexes in ${s.linkageClasses} linkage classes`} />
        </div>
      </Section>

      <Section id="rank" title="Rank and deficiency" help={GLOSSARY.rank + " " + GLOSSARY.deficiency}>
        <p className="font-mono text-base" data-testid="deficiency-formula">
          δ = n − ℓ − s = {s.complexes.length} − {s.linkageClasses} − {s.rank} = {s.deficiency}
        </p>
        <p className="text-sm">
          The reactions allow {s.rank} independent direction{s.rank === 1 ? "" : "s"} of change among {s.species.length} species.
        </p>
      </Section>

      <Section id="weak-reversibility" title="Weak reversibility" help={GLOSSARY.weakReversibility}>
        <p className="text-sm" data-testid="weak-reversibility">
          {s.weaklyReversible
            ? s.reversible
              ? "Weakly reversible: in fact every reaction has its reverse."
              : "Weakly reversible: every reaction lies on a cycle of reactions."
            : "Not weakly reversible: some reaction cannot be undone by any chain of reactions (look for strong linkage classes with arrows leaving them)."}
        </p>
      </Section>

      <Section id="deficiency-zero" title="Deficiency zero theorem" help={GLOSSARY.deficiencyZero}>
        <VerdictView verdict={dz} testId="deficiency-zero" />
      </Section>

      <Section id="deficiency-one" title="Deficiency one theorem" help={GLOSSARY.deficiencyOne}>
        <VerdictView verdict={s.deficiencyOneTheorem} testId="deficiency-one" />
      </Section>

      <Section id="conservation" title="Conservation laws" help={GLOSSARY.conservation}>
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

      <Section id="odes" title="Mass-action ODEs" help={GLOSSARY.odes}>
        <OdesView odes={odes} />
      </Section>
    </div>
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
