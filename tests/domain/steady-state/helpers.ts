import { readFileSync } from "node:fs";
import { parseRational } from "@domain/algebra/rational";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork, type AnalyseOptions } from "@domain/steady-state/index";

/** Parses `S=1,E=1/10` for tests. */
export const initial = (text: string) =>
  new Map(text.split(",").map((e) => {
    const [k, v] = e.split("=");
    return [k.trim(), parseRational(v)!] as const;
  }));

export const fixture = (name: string) => readFileSync(`tests/fixtures/networks/${name}.csv`, "utf8");

export const analyseCsv = (csv: string, options: AnalyseOptions = {}) =>
  analyseNetwork(parseNetworkCsv(csv), { timeoutMs: 60_000, ...options });

/** Evaluates a rational expression printed by the analysis (`(a + b)/(c*d)`) with numbers. */
export function evaluateExpression(text: string, scope: Record<string, number>): number {
  const js = text.replace(/\^/g, "**").replace(/[A-Za-z_][A-Za-z0-9_]*/g, (name) => {
    if (!(name in scope)) throw new Error(`no value for ${name}`);
    return `(${scope[name]})`;
  });
  return Function(`"use strict"; return (${js});`)() as number;
}

/** The two-site distributive phosphorylation cycle with the rate symbols of Wang & Sontag's layout. */
export const TWO_SITE_SYMBOLIC = `reaction,rate,reverse_rate
S0 + E <-> ES0,k1,k2
ES0 -> S1 + E,k3,
S1 + E <-> ES1,k4,k5
ES1 -> S2 + E,k6,
S2 + F <-> FS2,k7,k8
FS2 -> S1 + F,k9,
S1 + F <-> FS1,k10,k11
FS1 -> S0 + F,k12,
`;

/**
 * Rate values and totals (S0 = 2, E = 1, F = 1/20) with three positive steady states; found by a
 * seeded random search with this code and confirmed independently by multistart Newton in the tests.
 */
export const TWO_SITE_BISTABLE = `reaction,rate,reverse_rate,rate_value,reverse_rate_value
S0 + E <-> ES0,k1,k2,1/10,2
ES0 -> S1 + E,k3,,50,
S1 + E <-> ES1,k4,k5,5,2/100
ES1 -> S2 + E,k6,,10,
S2 + F <-> FS2,k7,k8,500,1/100
FS2 -> S1 + F,k9,,10,
S1 + F <-> FS1,k10,k11,500,5/10
FS1 -> S0 + F,k12,,200,
`;
