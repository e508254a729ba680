import Papa from "papaparse";
import { div, formatRational, isZero, ONE, parseRational, sign, eq, type Rational } from "../../algebra/rational";
import { SPECIES_NAME, formatComplex, makeComplex, type Complex } from "../complex";
import type { NetworkFileProblem } from "../errors";
import type { Network } from "../model";
import { tryParseNetworkCsv } from "../parse-csv";
import { formatConstantDeclaration } from "../constant-species";
import { formatInitialDeclaration } from "../initial-values";
import { MathError, readMathPolynomial, type Monomial } from "./mathml";
import { child, listed, readXml, type XmlElement } from "./xml-tree";

/** A located problem of an SBML file: the line, and the element and id it belongs to. */
export interface SbmlProblem extends NetworkFileProblem {
  /** Element name, e.g. `reaction`. */
  readonly element?: string;
  /** The element's SBML id, e.g. `R3`. */
  readonly id?: string;
}

/** What became of one `<reaction>`: read as mass action, or refused with the reason. */
export interface SbmlReactionReport {
  readonly id: string;
  readonly line: number;
  /** Arrow notation of the stoichiometry, e.g. `E + S <-> C` (even when the rate law was refused). */
  readonly text: string;
  readonly status: "read" | "refused";
  readonly reasons: readonly string[];
}

/** Everything read from an SBML file; `network` is there only when nothing was refused. */
export interface SbmlImport {
  readonly level?: number;
  readonly version?: number;
  readonly modelId?: string;
  readonly modelName?: string;
  readonly reactions: readonly SbmlReactionReport[];
  /** Initial concentrations of species that take part in reactions, exact. */
  readonly initial: ReadonlyMap<string, Rational>;
  /** Remarks on what was read in a form of our own (renamed local parameters, unused species, …). */
  readonly notes: readonly string[];
  /** Everything that keeps the file from becoming a network, in file order. */
  readonly problems: readonly SbmlProblem[];
  readonly network?: Network;
  /** The network as our CSV (the form a stored version takes). */
  readonly csv?: string;
}

const SUPPORTED = "SBML Level 2 (Versions 1–5; Version 4 is the one checked) or Level 3 Version 1 or 2 Core";
const EXPECTED_MASS_ACTION =
  "a mass-action law: one rate constant times the reactants' concentrations to their stoichiometric powers (minus the same for the products of a reversible reaction), optionally times the compartment";

interface SpeciesInfo {
  readonly id: string;
  readonly compartment: string;
  readonly line: number;
  readonly initial?: Rational;
  /** Held fixed: `boundaryCondition="true"` or `constant="true"` (read as a constant species). */
  readonly held: boolean;
}

interface ParameterInfo {
  readonly id: string;
  readonly value?: Rational;
  readonly constant: boolean;
  readonly line: number;
}

/**
 * Reads an SBML file (Level 2 Version 4 or Level 3 Version 1/2 Core) as a mass-action reaction
 * network. Every reaction's kinetic law must be mass action in the MathML (Horn & Jackson 1972;
 * read exactly as a polynomial), with integer stoichiometry; every other law, rule or event is
 * reported with its element, id and line, and
 * the rest of the file is still reported reaction by reaction. Local parameters whose ids are used
 * elsewhere are renamed `<id>_<reaction>` (listed in `notes`), because a rate symbol in our
 * networks is shared by every reaction that names it.
 * A species with `boundaryCondition="true"` or `constant="true"` is a constant species (`# constant:`),
 * held at its initialConcentration (or initialAmount / size), symbolic when the file gives none; a
 * boundary species that a rule moves is refused with its id. Initial values of the other species
 * become the version's `# initial:` line (and `initial`).
 *
 * Example: a file with reaction R1 (E + S ⇌ C, law `cell*(kon*E*S - koff*C)`) gives the row
 * `E + S <-> C` with rates kon, koff and their values, and `initial` E → 1 when
 * `initialConcentration="1"`.
 */
export function readSbml(text: string): SbmlImport {
  const problems: SbmlProblem[] = [];
  const notes: string[] = [];
  const xml = readXml(text);
  if (!xml.ok) return { reactions: [], initial: new Map(), notes, problems: [{ row: xml.line, message: xml.message, expected: "an SBML file" }] };
  const root = xml.root;
  if (root.name !== "sbml") {
    return empty([{ row: root.line, element: root.name, message: `the root element is <${root.name}>, not <sbml>`, expected: SUPPORTED }]);
  }
  const level = Number(root.attrs.level);
  const version = Number(root.attrs.version);
  if (!((level === 2 && version >= 1 && version <= 5) || (level === 3 && (version === 1 || version === 2)))) {
    return empty([{ row: root.line, element: "sbml", message: `SBML Level ${root.attrs.level ?? "?"} Version ${root.attrs.version ?? "?"} is not read`, expected: SUPPORTED }]);
  }
  if (root.attrs.required === "true") {
    problems.push({ row: root.line, element: "sbml", message: "the file needs an SBML Level 3 package (marked required) beyond Core", expected: "SBML Core only" });
  }
  const model = child(root, "model");
  if (!model) return { level, version, ...empty([{ row: root.line, element: "sbml", message: "the file has no <model>", expected: "an <sbml> element with one <model>" }]) };
  const at = (e: XmlElement, message: string, expected?: string): SbmlProblem => ({
    row: e.line,
    element: e.name,
    ...(e.attrs.id !== undefined ? { id: e.attrs.id } : {}),
    message: `<${e.name}${e.attrs.id !== undefined ? ` id="${e.attrs.id}"` : ""}>: ${message}`,
    ...(expected !== undefined ? { expected } : {}),
  });
  const bool = (e: XmlElement, name: string, dflt: boolean | undefined): boolean | undefined =>
    e.attrs[name] === undefined ? dflt : e.attrs[name] === "true" || e.attrs[name] === "1";
  const number = (e: XmlElement, name: string): Rational | undefined => {
    const s = e.attrs[name];
    if (s === undefined) return undefined;
    const v = parseRational(s);
    if (v === null) problems.push(at(e, `${name}="${s}" is not a finite number`, "a decimal such as 0.5 or 2e-3"));
    return v ?? undefined;
  };
  if (model.attrs.conversionFactor !== undefined) problems.push(at(model, "a conversion factor changes the dynamics beyond mass action", "no conversionFactor"));

  // Initial assignments: a constant number replaces the attribute value exactly (our export writes
  // rationals such as 1/3 this way); anything else is refused, since the value would depend on it.
  const assigned = new Map<string, Rational>();
  for (const ia of listed(model, "listOfInitialAssignments", "initialAssignment")) {
    const target = ia.attrs.symbol ?? "";
    const math = child(ia, "math");
    let value: Rational | null = null;
    try {
      const poly = math ? readMathPolynomial(math) : [];
      if (poly.length === 0) value = { num: 0n, den: 1n };
      else if (poly.length === 1 && poly[0].powers.size === 0) value = poly[0].coefficient;
    } catch {
      value = null;
    }
    if (value === null) problems.push({ ...at(ia, `the initial assignment of \`${target}\` is not a plain number`, "a number"), id: target });
    else assigned.set(target, value);
  }

  const compartments = new Map<string, { size?: Rational; line: number }>();
  for (const c of listed(model, "listOfCompartments", "compartment")) {
    const size = assigned.get(c.attrs.id) ?? number(c, "size") ?? number(c, "volume");
    compartments.set(c.attrs.id, { ...(size !== undefined ? { size } : {}), line: c.line });
    if (bool(c, "constant", true) === false) problems.push(at(c, "a compartment whose size changes is not mass action in concentrations", 'constant="true"'));
  }

  const ruleTargets = new Set((child(model, "listOfRules")?.children ?? []).map((r) => r.attrs.variable ?? ""));
  const species = new Map<string, SpeciesInfo>();
  for (const s of listed(model, "listOfSpecies", "species")) {
    const id = s.attrs.id ?? "";
    const before = problems.length;
    if (!SPECIES_NAME.test(id)) problems.push(at(s, `species id \`${id}\` is not a name we can use`, "a letter, then letters, digits or `_`"));
    // A boundary or constant species is not changed by the reactions: a constant species here.
    const held = bool(s, "boundaryCondition", false) === true || bool(s, "constant", false) === true;
    if (s.attrs.conversionFactor !== undefined) problems.push(at(s, "a conversion factor changes the dynamics beyond mass action", "no conversionFactor"));
    const compartment = s.attrs.compartment ?? "";
    const comp = compartments.get(compartment);
    if (!comp) problems.push(at(s, `compartment \`${compartment}\` is not declared`, "a compartment from <listOfCompartments>"));
    const onlySubstance = bool(s, "hasOnlySubstanceUnits", false);
    if (onlySubstance && !(comp?.size && eq(comp.size, ONE))) {
      problems.push(at(s, "the species is counted in amounts (hasOnlySubstanceUnits) in a compartment whose size is not 1", "concentrations, or a compartment of size 1"));
    }
    let initial: Rational | undefined = assigned.get(id) ?? number(s, "initialConcentration");
    const amount = number(s, "initialAmount");
    if (initial === undefined && amount !== undefined) {
      if (comp?.size && !isZero(comp.size)) initial = div(amount, comp.size);
      else if (comp) problems.push(at(s, "an initial amount in a compartment without a size has no concentration", "initialConcentration, or a compartment size"));
    }
    if (initial !== undefined && sign(initial) < 0) problems.push(at(s, `negative initial value ${formatRational(initial)}`, "a value ≥ 0"));
    if (held && !ruleTargets.has(id) && initial !== undefined && sign(initial) === 0) {
      problems.push(at(s, `species \`${id}\` is held fixed at 0, which takes its reactions out of the network`, "a positive initialConcentration or initialAmount for a boundary or constant species, or none for a symbolic one"));
    }
    if (problems.length === before || !species.has(id)) species.set(id, { id, compartment, line: s.line, held, ...(initial !== undefined ? { initial } : {}) });
  }

  const parameters = new Map<string, ParameterInfo>();
  for (const p of listed(model, "listOfParameters", "parameter")) {
    const value = assigned.get(p.attrs.id) ?? number(p, "value");
    parameters.set(p.attrs.id, { id: p.attrs.id, ...(value !== undefined ? { value } : {}), constant: bool(p, "constant", true) !== false, line: p.line });
  }
  const functions = new Set(listed(model, "listOfFunctionDefinitions", "functionDefinition").map((f) => f.attrs.id));

  const rules = child(model, "listOfRules")?.children ?? [];
  for (const r of rules) {
    const target = r.attrs.variable ?? "";
    const boundary = listed(model, "listOfSpecies", "species").find((x) => x.attrs.id === target && bool(x, "boundaryCondition", false) === true && bool(x, "constant", false) !== true);
    if (boundary) {
      // A boundary species that rules move is neither a variable of the reactions nor held constant.
      problems.push({
        ...at(boundary, `species \`${target}\` is a boundary species (boundaryCondition="true", constant="false") whose value the ${r.name} on line ${r.line} sets; such species are not read`, 'a boundary species without rules (it is then held at its initial value) or constant="true"'),
        id: target,
      });
    } else problems.push({ ...at(r, `${r.name}${target ? ` for \`${target}\`` : ""} changes the model beyond its reactions`, "reactions with mass-action laws only (no rules)"), ...(target ? { id: target } : {}) });
  }
  for (const e of listed(model, "listOfEvents", "event")) problems.push(at(e, "events change the model during a run", "no events"));
  if (listed(model, "listOfConstraints", "constraint").length > 0) notes.push("constraints (checks a simulator may make) are not kept; they do not change the dynamics");

  // Every global id, so a local parameter that shadows one gets a name of its own.
  const globalIds = new Set<string>([...species.keys(), ...compartments.keys(), ...parameters.keys(), ...functions]);
  const usedRates = new Set<string>();
  const reports: SbmlReactionReport[] = [];
  const rows: Record<string, string>[] = [];
  const rowLines: number[] = [];
  const rowIds: string[] = [];
  const reactionSpecies: string[] = [];
  const reactionList = listed(model, "listOfReactions", "reaction");
  const speciesOrder = [...species.keys()];

  for (const r of reactionList) {
    const rid = r.attrs.id ?? "";
    const reasons: string[] = [];
    const refuse = (e: XmlElement, message: string, expected?: string) => {
      reasons.push(message);
      problems.push({ ...at(e, message, expected), element: "reaction", id: rid, message: `<reaction id="${rid}">: ${message}` });
    };
    if (bool(r, "fast", false)) refuse(r, 'a fast reaction (fast="true") is an equilibrium assumption, not mass action', 'fast="false"');
    const side = (list: string): Complex => {
      const terms: [string, number][] = [];
      for (const ref of listed(r, list, "speciesReference")) {
        const sp = ref.attrs.species ?? "";
        if (!species.has(sp) && !listed(model, "listOfSpecies", "species").some((s) => s.attrs.id === sp)) {
          refuse(ref, `species \`${sp}\` is not declared`, "a species from <listOfSpecies>");
          continue;
        }
        if (child(ref, "stoichiometryMath")) {
          refuse(ref, `the stoichiometry of \`${sp}\` is given by a formula`, "a whole-number stoichiometry attribute");
          continue;
        }
        const text = ref.attrs.stoichiometry ?? (level === 2 ? "1" : undefined);
        if (text === undefined) {
          refuse(ref, `the stoichiometry of \`${sp}\` is not given`, 'stoichiometry="1" (or another whole number)');
          continue;
        }
        const v = parseRational(text);
        if (v === null || v.den !== 1n || v.num <= 0n || v.num > 1_000_000n) {
          refuse(ref, `stoichiometry ${text} of \`${sp}\` is not a whole number`, "a whole number from 1 to 1000000");
          continue;
        }
        if (ref.attrs.constant === "false") refuse(ref, `the stoichiometry of \`${sp}\` may change during a run`, 'constant="true"');
        terms.push([sp, Number(v.num)]);
        if (!reactionSpecies.includes(sp)) reactionSpecies.push(sp);
      }
      return makeComplex(terms);
    };
    const left = side("listOfReactants");
    const right = side("listOfProducts");
    const text = (arrow: string) => `${formatComplex(left, speciesOrder)} ${arrow} ${formatComplex(right, speciesOrder)}`;
    const modifiers = listed(r, "listOfModifiers", "modifierSpeciesReference").map((m) => m.attrs.species ?? "");

    // The kinetic law: local parameters first (they shadow global ids), then the polynomial.
    const law = child(r, "kineticLaw");
    const local = new Map<string, ParameterInfo & { name: string }>();
    let terms: readonly Monomial[] = [];
    if (!law) refuse(r, "the reaction has no kinetic law", EXPECTED_MASS_ACTION);
    else {
      for (const p of [...listed(law, "listOfParameters", "parameter"), ...listed(law, "listOfLocalParameters", "localParameter")]) {
        const value = number(p, "value");
        local.set(p.attrs.id, { id: p.attrs.id, name: p.attrs.id, ...(value !== undefined ? { value } : {}), constant: true, line: p.line });
      }
      const math = child(law, "math");
      if (!math) refuse(law, "the kinetic law has no <math>", EXPECTED_MASS_ACTION);
      else {
        try {
          terms = readMathPolynomial(math);
        } catch (e) {
          if (!(e instanceof MathError)) throw e;
          refuse(math, `the kinetic law is not mass action: it ${e.message}`, EXPECTED_MASS_ACTION);
        }
      }
    }

    // Classify each term: rate constant × compartment? × species powers.
    interface Term {
      readonly positive: boolean;
      readonly complex: Complex;
      readonly rate?: ParameterInfo & { name: string };
      readonly number?: Rational;
      readonly compartment?: string;
    }
    const read: Term[] = [];
    for (const m of terms) {
      const speciesPowers: [string, number][] = [];
      const rates: (ParameterInfo & { name: string })[] = [];
      const comps: string[] = [];
      let ok = true;
      for (const [s, p] of m.powers) {
        const isLocal = local.get(s);
        if (isLocal || parameters.has(s)) {
          if (p !== 1) {
            refuse(law!, `the rate constant \`${s}\` appears to the power ${p}`, EXPECTED_MASS_ACTION);
            ok = false;
          } else rates.push(isLocal ?? { ...parameters.get(s)!, name: s });
        } else if (compartments.has(s)) {
          if (p !== 1) {
            refuse(law!, `the compartment \`${s}\` appears to the power ${p}`, EXPECTED_MASS_ACTION);
            ok = false;
          } else comps.push(s);
        } else if (listed(model, "listOfSpecies", "species").some((x) => x.attrs.id === s)) {
          if (modifiers.includes(s) && left[s] === undefined && right[s] === undefined) {
            refuse(law!, `the modifier \`${s}\` appears in the rate law; write it as both reactant and product for mass action`, EXPECTED_MASS_ACTION);
            ok = false;
          } else if (p < 0) {
            refuse(law!, `the species \`${s}\` appears to the power ${p}`, EXPECTED_MASS_ACTION);
            ok = false;
          } else speciesPowers.push([s, p]);
        } else if (functions.has(s)) {
          refuse(law!, `it uses the function \`${s}\``, EXPECTED_MASS_ACTION);
          ok = false;
        } else {
          refuse(law!, `the rate law names \`${s}\`, which is not a species, compartment or parameter`, "names declared in the file");
          ok = false;
        }
      }
      if (!ok) continue;
      if (rates.length > 1) {
        refuse(law!, `a term multiplies ${rates.length} parameters (${rates.map((x) => x.id).join(", ")}); mass action has one rate constant per direction`, EXPECTED_MASS_ACTION);
        continue;
      }
      if (comps.length > 1) {
        refuse(law!, `a term multiplies ${comps.length} compartments`, EXPECTED_MASS_ACTION);
        continue;
      }
      const positive = sign(m.coefficient) > 0;
      const magnitude = positive ? m.coefficient : { num: -m.coefficient.num, den: m.coefficient.den };
      if (rates.length === 1 && !eq(magnitude, ONE)) {
        refuse(law!, `a term multiplies the rate constant \`${rates[0].id}\` by the number ${formatRational(magnitude)}`, EXPECTED_MASS_ACTION);
        continue;
      }
      read.push({
        positive,
        complex: makeComplex(speciesPowers),
        ...(rates.length === 1 ? { rate: rates[0] } : { number: magnitude }),
        ...(comps.length === 1 ? { compartment: comps[0] } : {}),
      });
    }
    const forward = read.filter((t) => t.positive);
    const reverse = read.filter((t) => !t.positive);
    if (reasons.length === 0 && law) {
      if (read.length === 0) refuse(law, "the kinetic law is zero", EXPECTED_MASS_ACTION);
      else if (forward.length !== 1 || reverse.length > 1) {
        refuse(law, `the kinetic law has ${forward.length} positive and ${reverse.length} negative terms`, EXPECTED_MASS_ACTION);
      } else {
        if (formatComplex(forward[0].complex) !== formatComplex(left)) {
          refuse(law, `the forward term has concentrations ${formatComplex(forward[0].complex)} but the reactants are ${formatComplex(left)}`, EXPECTED_MASS_ACTION);
        }
        if (reverse[0] && formatComplex(reverse[0].complex) !== formatComplex(right)) {
          refuse(law, `the reverse term has concentrations ${formatComplex(reverse[0].complex)} but the products are ${formatComplex(right)}`, EXPECTED_MASS_ACTION);
        }
      }
    }
    // Volumes: a law in amount per time (×compartment) divided by the volume is the concentration
    // rate, so the compartment cancels; without it, only a volume of 1 leaves the constants as written.
    const involved = [...new Set([...Object.keys(left), ...Object.keys(right)])];
    const comps = new Set(involved.map((s) => species.get(s)?.compartment).filter((c): c is string => c !== undefined));
    if (comps.size > 1) refuse(r, `the reaction joins species of the compartments ${[...comps].join(", ")} (transport between volumes)`, "all species of a reaction in one compartment");
    else if (reasons.length === 0) {
      const comp = [...comps][0];
      for (const t of read) {
        if (t.compartment !== undefined && comp !== undefined && t.compartment !== comp) {
          refuse(law!, `the rate law multiplies by the compartment \`${t.compartment}\`, but the species are in \`${comp}\``, EXPECTED_MASS_ACTION);
        } else if (t.compartment === undefined && comp !== undefined) {
          const size = compartments.get(comp)?.size;
          if (!size || !eq(size, ONE)) {
            refuse(law!, `the rate law has no volume factor and compartment \`${comp}\` has size ${size ? formatRational(size) : "not given"}, so its constants are not the concentration constants`, `a law multiplied by \`${comp}\`, or a compartment of size 1`);
          }
        } else if (t.compartment !== undefined && comp === undefined) {
          refuse(law!, `the rate law multiplies by the compartment \`${t.compartment}\` but the reaction has no species`, EXPECTED_MASS_ACTION);
        }
      }
      if (forward.length === 1 && reverse.length === 0 && bool(r, "reversible", level === 2) === true) {
        notes.push(`reaction ${rid} is marked reversible but its law has no reverse term; it is read as irreversible`);
      }
      if (reverse.length === 1 && bool(r, "reversible", level === 2) === false) {
        notes.push(`reaction ${rid} is marked irreversible but its law has a reverse term; it is read as reversible`);
      }
    }
    if (listed(r, "listOfReactants", "speciesReference").length === 0 && listed(r, "listOfProducts", "speciesReference").length === 0) {
      refuse(r, "the reaction has neither reactants nor products", "at least one species");
    }

    const rateName = (t: Term, suffix: string): { name: string; value?: Rational; param?: ParameterInfo } => {
      if (t.rate) {
        const p = t.rate;
        if (!p.constant) refuse(r, `the rate constant \`${p.id}\` may change during a run (constant="false")`, 'constant="true"');
        if (!SPECIES_NAME.test(p.id)) refuse(r, `rate constant id \`${p.id}\` is not a name we can use`, "a letter, then letters, digits or `_`");
        let name = p.id;
        if (local.has(p.id) && (globalIds.has(p.id) || usedRates.has(p.id))) {
          name = unique(`${p.id}_${rid}`, (n) => globalIds.has(n) || usedRates.has(n));
          notes.push(`local parameter ${p.id} of reaction ${rid} is named ${name}, since ${p.id} is used elsewhere`);
        }
        return { name, ...(p.value !== undefined ? { value: p.value } : {}), param: p };
      }
      const name = unique(`k_${rid}${suffix}`, (n) => globalIds.has(n) || usedRates.has(n));
      notes.push(`reaction ${rid}: the number ${formatRational(t.number!)} in its law is the rate constant ${name}`);
      return { name, value: t.number! };
    };
    if (reasons.length === 0) {
      const f = rateName(forward[0], "");
      const b = reverse[0] ? rateName(reverse[0], "_rev") : undefined;
      for (const x of [f, b]) {
        if (x === undefined) continue;
        if (x.value !== undefined && sign(x.value) <= 0) refuse(r, `the rate constant \`${x.name}\` has the value ${formatRational(x.value)}`, "a positive value");
      }
      if (reasons.length === 0) {
        usedRates.add(f.name);
        if (b) usedRates.add(b.name);
        const row: Record<string, string> = {
          reaction: text(b ? "<->" : "->"),
          label: r.attrs.name?.trim() || rid,
          rate: f.name,
          reverse_rate: b?.name ?? "",
          rate_value: f.value !== undefined ? formatRational(f.value) : "",
          reverse_rate_value: b?.value !== undefined ? formatRational(b.value) : "",
        };
        rows.push(row);
        rowLines.push(r.line);
        rowIds.push(rid);
      }
    }
    reports.push({ id: rid, line: r.line, text: text(reverse.length === 1 ? "<->" : "->"), status: reasons.length === 0 ? "read" : "refused", reasons });
  }
  if (reactionList.length === 0) problems.push({ row: model.line, element: "model", message: "the model has no reactions", expected: "at least one <reaction>" });

  const unused = [...species.keys()].filter((s) => !reactionSpecies.includes(s));
  if (unused.length > 0) notes.push(`species taking part in no reaction are left out: ${unused.join(", ")}`);
  const initial = new Map<string, Rational>();
  const held: { name: string; value?: Rational }[] = [];
  for (const s of reactionSpecies) {
    const info = species.get(s);
    if (info?.held) held.push({ name: s, ...(info.initial !== undefined ? { value: info.initial } : {}) });
    else if (info?.initial !== undefined) initial.set(s, info.initial);
  }
  const base = {
    level,
    version,
    ...(model.attrs.id !== undefined ? { modelId: model.attrs.id } : {}),
    ...(model.attrs.name !== undefined ? { modelName: model.attrs.name } : {}),
    reactions: reports,
    initial,
    notes,
  };
  if (problems.length > 0) return { ...base, problems: sortProblems(problems) };

  // The same checks as an uploaded CSV (shared symbols agree, a symbol is no species name, …),
  // located back at the SBML reaction each row came from.
  const fields = ["reaction", "label", "rate", "reverse_rate", "rate_value", "reverse_rate_value"].filter(
    (f) => f === "reaction" || f === "rate" || rows.some((row) => row[f] !== ""),
  );
  // Held species and initial values as the file's directive lines, after the rows so that CSV line
  // i + 2 stays the i-th reaction.
  const directives =
    (held.length > 0 ? formatConstantDeclaration(held.map((h) => ({ ...h, line: 0 }))) + "\n" : "") +
    (initial.size > 0 ? formatInitialDeclaration([...initial].map(([name, value]) => ({ name, value, line: 0 }))) + "\n" : "");
  const csv = Papa.unparse({ fields, data: rows.map((row) => fields.map((f) => row[f])) }, { newline: "\n" }) + "\n" + directives;
  const parsed = tryParseNetworkCsv(csv);
  if (!parsed.ok) {
    return {
      ...base,
      problems: sortProblems(
        parsed.problems.map((p) => {
          const i = p.row - 2;
          const rid = i >= 0 ? rowIds[i] : undefined;
          if (rid === undefined && (p.column === "constant" || p.column === "initial")) {
            // A directive entry: locate it at the species it names.
            const name = /`([^`]+)`/.exec(p.message)?.[1];
            const sp = name !== undefined ? species.get(name) : undefined;
            return { row: sp?.line ?? model.line, element: "species", ...(name ? { id: name } : {}), message: `${name ? `<species id="${name}">: ` : ""}${p.message}`, ...(p.expected ? { expected: p.expected } : {}) };
          }
          return { row: i >= 0 ? rowLines[i] : model.line, element: "reaction", ...(rid ? { id: rid } : {}), message: `${rid ? `<reaction id="${rid}">: ` : ""}${p.message}`, ...(p.expected ? { expected: p.expected } : {}) };
        }),
      ),
    };
  }
  return { ...base, problems: [], network: parsed.network, csv };
}

function empty(problems: SbmlProblem[]): SbmlImport {
  return { reactions: [], initial: new Map(), notes: [], problems };
}

const sortProblems = (ps: SbmlProblem[]): SbmlProblem[] => [...ps].sort((a, b) => a.row - b.row);

function unique(base: string, taken: (n: string) => boolean): string {
  if (!taken(base)) return base;
  for (let i = 2; ; i++) if (!taken(`${base}_${i}`)) return `${base}_${i}`;
}
