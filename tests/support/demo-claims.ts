import { parseRational } from "@domain/algebra/rational";
import type { Rational } from "@domain/algebra/rational";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork } from "@domain/steady-state/analyse";
import type { DemoClaims } from "~/networks/demos";

const NUMBER_WORDS: Record<string, number> = { no: 0, one: 1, a: 1, two: 2, three: 3, four: 4, five: 5 };

/** Claims a demo text makes in words: numbers of steady states, deficiency, weak reversibility, switching. */
export function claimsInText(text: string): { count?: number; switching: boolean; deficiency?: number; weaklyReversible?: boolean } {
  const count = /\b(no|one|two|three|four|five|\d+) positive steady states?\b/i.exec(text)?.[1]?.toLowerCase();
  const deficiency = /\bdeficiency (zero|one|two|\d+)\b/i.exec(text)?.[1]?.toLowerCase();
  const wr = /\b(not )?weakly reversible\b/i.exec(text);
  const asNumber = (w: string) => NUMBER_WORDS[w] ?? (w === "zero" ? 0 : Number(w));
  return {
    ...(count !== undefined ? { count: asNumber(count) } : {}),
    switching: /bistab|multista|\bswitch(es)?\b|more than one positive steady state/i.test(text),
    ...(deficiency !== undefined ? { deficiency: asNumber(deficiency) } : {}),
    ...(wr ? { weaklyReversible: wr[1] === undefined } : {}),
  };
}

/**
 * Everything a demo's text and claims say that the engine contradicts, as sentences; [] when
 * all holds. The engine's verdict is the reference: analyseStructure for deficiency and weak
 * reversibility, analyseNetwork for the positive steady states and their stability.
 */
export function demoProblems(demo: { name: string; text: string; csv: string; claims?: DemoClaims }): string[] {
  const problems: string[] = [];
  const network = parseNetworkCsv(demo.csv);
  const structure = analyseStructure(network);
  const words = claimsInText(demo.text);
  const claims = demo.claims ?? {};
  const deficiency = claims.deficiency ?? words.deficiency;
  const weaklyReversible = claims.weaklyReversible ?? words.weaklyReversible;
  if (words.deficiency !== undefined && claims.deficiency !== undefined && words.deficiency !== claims.deficiency)
    problems.push(`${demo.name}: the text says deficiency ${words.deficiency}, the claims ${claims.deficiency}`);
  if (deficiency !== undefined && deficiency !== structure.deficiency)
    problems.push(`${demo.name}: claims deficiency ${deficiency}, the engine finds ${structure.deficiency}`);
  if (weaklyReversible !== undefined && weaklyReversible !== structure.weaklyReversible)
    problems.push(`${demo.name}: claims ${weaklyReversible ? "" : "not "}weakly reversible, the engine finds the opposite`);
  if (words.switching && structure.deficiencyZeroTheorem.applies && structure.weaklyReversible)
    problems.push(
      `${demo.name}: the text speaks of a switch or several steady states, but the network is deficiency zero and weakly reversible (exactly one positive steady state per class, Feinberg 1987)`,
    );
  const claimed = claims.steadyStates;
  if ((words.switching || words.count !== undefined) && !claimed)
    problems.push(`${demo.name}: the text speaks of steady states but the demo carries no steady-state claim to check`);
  if (claimed) {
    if (words.count !== undefined && words.count !== claimed.count) problems.push(`${demo.name}: the text says ${words.count} positive steady states, the claims ${claimed.count}`);
    if (words.switching && claimed.stable < 2) problems.push(`${demo.name}: a switch needs two stable steady states; the claims give ${claimed.stable}`);
    const initial = claimed.initial ? new Map(Object.entries(claimed.initial).map(([k, v]) => [k, parseRational(v) as Rational])) : undefined;
    const result = analyseNetwork(network, initial ? { initial } : {});
    const states = result.steadyStates;
    if (!states) problems.push(`${demo.name}: the engine lists no steady states (${result.steadyStatesReason})`);
    else {
      if (states.length !== claimed.count) problems.push(`${demo.name}: claims ${claimed.count} positive steady states, the engine finds ${states.length}`);
      const stable = states.filter((s) => s.stable === true).length;
      if (stable !== claimed.stable) problems.push(`${demo.name}: claims ${claimed.stable} stable steady states, the engine finds ${stable}`);
      claimed.concentrations?.forEach((c, i) => {
        for (const [s, v] of Object.entries(c))
          if (!(Math.abs((states[i]?.concentrations[s] ?? NaN) - v) < 1e-9)) problems.push(`${demo.name}: claims ${s} = ${v} at steady state ${i + 1}, the engine finds ${states[i]?.concentrations[s]}`);
      });
    }
  }
  return problems;
}
