import type { Rational } from "../../algebra/rational";
import type { Complex } from "../complex";
import type { DirectedReaction, Network } from "../model";
import { initialMapOf } from "../initial-values";
import { exactDecimal, writeNumber } from "./mathml";

export interface SbmlWriteOptions {
  /** Model id (made a valid SBML id); default `network`. */
  readonly id?: string;
  /** Model name, written as is (escaped). */
  readonly name?: string;
  /** Initial concentrations, exact; default the network's own (`# initial:`). */
  readonly initial?: ReadonlyMap<string, Rational>;
}

const SID = /^[A-Za-z_][A-Za-z0-9_]*$/;

/**
 * Writes a network as SBML Level 3 Version 2 Core: one compartment of size 1, every species
 * (with its initial concentration when given, by default the network's `# initial:` values), every
 * constant species as a species with boundaryCondition="true" constant="true" whose held value is its
 * initialConcentration (a symbolic held value is written without one: the species' value is then
 * undefined in SBML, as it is a parameter without a value here), every rate symbol as a global constant parameter
 * (so a symbol shared by several reactions stays one constant), and one reaction per row with a
 * mass-action kinetic law in MathML, `compartment · (k_f·Π reactants − k_r·Π products)` (amount per
 * time, as the SBML Level 3 Version 2 Core specification, section 4.11.7, asks). Values that are not exact decimals
 * (e.g. 1/3) are written as exact rational numbers in an initial assignment, so nothing is rounded.
 * A constant species is listed among the reactants and products as the row writes it, and its
 * concentration is a factor of the kinetic law (SBML Level 3 Version 2 Core, section 4.6.6: a
 * boundary species is not changed by reactions, so it may take part in them while held).
 * readSbml of the output gives the same species, directed reactions, rate symbols and values.
 *
 * Example: the network of "reaction,rate\nA -> B,k\n" gives one reaction r1 with
 * <kineticLaw><math>… <times/><ci>compartment</ci><ci>k</ci><ci>A</ci> …</math></kineticLaw>.
 */
export function formatSbml(network: Network, options: SbmlWriteOptions = {}): string {
  const held = network.constants ?? [];
  const allSpecies = [...network.species, ...held.map((c) => c.name)];
  const initial = options.initial ?? initialMapOf(network);
  const taken = new Set<string>(allSpecies);
  for (const r of network.reactions) taken.add(r.rate);
  const fresh = (base: string): string => {
    let name = base;
    for (let i = 2; taken.has(name); i++) name = `${base}_${i}`;
    taken.add(name);
    return name;
  };
  const compartment = fresh("compartment");
  const modelId = (() => {
    const s = (options.id ?? "network").replace(/[^A-Za-z0-9_]/g, "_");
    return /^[A-Za-z_]/.test(s) ? s : `m_${s}`;
  })();

  // Rate symbols in order of first use, with their values.
  const rates = new Map<string, Rational | undefined>();
  for (const r of network.reactions) if (!rates.has(r.rate) || rates.get(r.rate) === undefined) rates.set(r.rate, r.rateValue);

  const assignments: string[] = [];
  const valueAttr = (name: string, attr: string, v: Rational | undefined): string => {
    if (v === undefined) return "";
    const d = exactDecimal(v);
    if (d !== null) return ` ${attr}="${d}"`;
    assignments.push(`      <initialAssignment symbol="${name}">\n        <math xmlns="http://www.w3.org/1998/Math/MathML">${writeNumber(v)}</math>\n      </initialAssignment>`);
    return "";
  };

  const species = [
    ...network.species.map(
      (s) =>
        `      <species id="${s}" compartment="${compartment}"${valueAttr(s, "initialConcentration", initial.get(s))} hasOnlySubstanceUnits="false" boundaryCondition="false" constant="false"/>`,
    ),
    ...held.map(
      (c) =>
        `      <species id="${c.name}" compartment="${compartment}"${valueAttr(c.name, "initialConcentration", c.value)} hasOnlySubstanceUnits="false" boundaryCondition="true" constant="true"/>`,
    ),
  ];
  const parameters = [...rates].map(([k, v]) => `      <parameter id="${k}"${valueAttr(k, "value", v)} constant="true"/>`);

  // Each row's directed reactions, in order (a `<->` row has two, the forward one first).
  const byRow = new Map<number, DirectedReaction[]>();
  for (const r of network.reactions) byRow.set(r.row, [...(byRow.get(r.row) ?? []), r]);
  const reactions = network.rows.map((row, i) => {
    const [f, b] = byRow.get(row.line) ?? [];
    // The complexes as written, constant species included, in the direction of the forward reaction.
    const [reactants, products] = row.arrow === "<-" ? [row.right, row.left] : [row.left, row.right];
    const id = row.label !== undefined && SID.test(row.label) && !taken.has(row.label) ? row.label : fresh(`r${i + 1}`);
    taken.add(id);
    const refs = (list: string, c: Complex): string => {
      const names = Object.keys(c).sort((a, z) => allSpecies.indexOf(a) - allSpecies.indexOf(z));
      if (names.length === 0) return "";
      return `        <${list}>\n${names.map((s) => `          <speciesReference species="${s}" stoichiometry="${c[s]}" constant="true"/>`).join("\n")}\n        </${list}>\n`;
    };
    const term = (r: DirectedReaction): string => {
      const factors = [`<ci>${r.rate}</ci>`];
      for (const [s, n] of Object.entries({ ...r.reactant, ...(r.held ?? {}) })) {
        factors.push(n === 1 ? `<ci>${s}</ci>` : `<apply><power/><ci>${s}</ci><cn type="integer">${n}</cn></apply>`);
      }
      return factors.length === 1 ? factors[0] : `<apply><times/>${factors.join("")}</apply>`;
    };
    const rate = b ? `<apply><minus/>${term(f)}${term(b)}</apply>` : term(f);
    return (
      `      <reaction id="${id}"${row.label !== undefined ? ` name="${escapeXml(row.label)}"` : ""} reversible="${b ? "true" : "false"}">\n` +
      refs("listOfReactants", reactants) +
      refs("listOfProducts", products) +
      `        <kineticLaw>\n          <math xmlns="http://www.w3.org/1998/Math/MathML">\n            <apply><times/><ci>${compartment}</ci>${rate}</apply>\n          </math>\n        </kineticLaw>\n` +
      `      </reaction>`
    );
  });

  const lines = [
    `<?xml version="1.0" encoding="UTF-8"?>`,
    `<sbml xmlns="http://www.sbml.org/sbml/level3/version2/core" level="3" version="2">`,
    `  <model id="${modelId}"${options.name !== undefined ? ` name="${escapeXml(options.name)}"` : ""}>`,
    `    <listOfCompartments>`,
    `      <compartment id="${compartment}" spatialDimensions="3" size="1" constant="true"/>`,
    `    </listOfCompartments>`,
    `    <listOfSpecies>`,
    ...species,
    `    </listOfSpecies>`,
    ...(parameters.length > 0 ? [`    <listOfParameters>`, ...parameters, `    </listOfParameters>`] : []),
    ...(assignments.length > 0 ? [`    <listOfInitialAssignments>`, ...assignments, `    </listOfInitialAssignments>`] : []),
    `    <listOfReactions>`,
    ...reactions,
    `    </listOfReactions>`,
    `  </model>`,
    `</sbml>`,
  ];
  return lines.join("\n") + "\n";
}

const escapeXml = (s: string): string =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;").replace(/\n/g, "&#10;");
