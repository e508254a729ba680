/**
 * Cross-check against an outside computer algebra system: SymPy 1.11 (Debian python3-sympy,
 * called as /usr/bin/python3), functions Poly.count_roots (distinct real roots in a closed
 * interval) and real_roots (real roots with multiplicity, exact, evaluated to 30 digits).
 */
import { execFileSync } from "node:child_process";
import { describe, expect, it } from "vitest";
import { type Rational, compare, formatRational, parseRational, sub } from "@domain/algebra/rational";
import {
  type IntPoly,
  compareRootWithRational,
  countRealRootsSturm,
  fromIntegerCoefficients,
  fromRoots,
  isolateRealRoots,
  mulInt,
  refineRootInterval,
  subInt,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

const SYMPY_SCRIPT = `
import json, sys
from sympy import Poly, symbols, real_roots, Rational, N, sympify
x = symbols('x')
out = []
for case in json.load(sys.stdin):
    p = Poly([int(c) for c in case['coeffs']], x)
    res = {'count': int(p.count_roots())}
    res['counts'] = [int(p.count_roots(Rational(a), Rational(b))) for a, b in case['intervals']]
    if case['roots']:
        res['roots'] = [[str(r) if r.is_Rational else None, str(N(r, 30))] for r in real_roots(p)]
    out.append(res)
digits = {}
for name, expr, d in [('sqrt2', 'sqrt(2)', 1010), ('x5', 'real_roots(x**5 - x - 1)[0]', 1010)]:
    digits[name] = str(N(sympify(expr, locals={'x': x}), d))
print(json.dumps({'cases': out, 'digits': digits}))
`;

interface Case {
  name: string;
  p: IntPoly;
  intervals: [Rational, Rational][];
  roots: boolean;
}
interface SympyAnswer {
  count: number;
  counts: number[];
  roots?: [string | null, string][];
}

function askSympy(cases: Case[]): { cases: SympyAnswer[]; digits: Record<string, string> } {
  const input = JSON.stringify(
    cases.map((c) => ({
      coeffs: [...c.p].reverse().map(String), // SymPy lists the highest coefficient first
      intervals: c.intervals.map(([a, b]) => [formatRational(a), formatRational(b)]),
      roots: c.roots,
    })),
  );
  return JSON.parse(execFileSync("/usr/bin/python3", ["-c", SYMPY_SCRIPT], { input, encoding: "utf8" }));
}

function buildCases(): Case[] {
  const sqrt2: IntPoly = [-2n, 0n, 1n];
  const mignotte = subInt(fromIntegerCoefficients([...Array(12).fill(0), 1]), mulInt([2n], mulInt([-1n, 10n], [-1n, 10n])));
  const wilkinson = fromRoots(Array.from({ length: 20 }, (_, i) => q(i + 1)));
  const perturbed = subInt(wilkinson.map((c) => c << 23n), fromIntegerCoefficients([...Array(19).fill(0), 1]));
  const cases: Case[] = [
    { name: "(x-1)^2 (x-2)(x^2-2)", p: mulInt(fromRoots([q(1), q(1), q(2)]), sqrt2), intervals: [[q(1), q(2)], [q(-2), q(1, 2)]], roots: true },
    { name: "(x^2-2)(x^2-3)(3x-1)^3", p: mulInt(mulInt(sqrt2, [-3n, 0n, 1n]), fromRoots([q(1, 3), q(1, 3), q(1, 3)])), intervals: [[q(1, 3), q(3, 2)]], roots: true },
    { name: "Mignotte x^12 - 2(10x-1)^2", p: mignotte, intervals: [[q(9, 100), q(11, 100)], [q(0), q(1)]], roots: true },
    { name: "Wilkinson 2^23·W(x) - x^19", p: perturbed, intervals: [[q(8), q(9)], [q(10), q(20)], [q(20), q(21)]], roots: false },
  ];
  const rnd = prng(1811);
  for (let t = 0; t < 8; t++) {
    const p = fromIntegerCoefficients([...Array.from({ length: rnd.int(2, 8) }, () => rnd.int(-20, 20)), rnd.int(1, 4)]);
    const a = q(rnd.int(-30, 0), rnd.int(1, 7));
    const b = q(rnd.int(0, 30), rnd.int(1, 7));
    cases.push({ name: `seeded random #${t}`, p, intervals: [[a, b]], roots: true });
  }
  return cases;
}

describe("real roots against SymPy 1.11 (Poly.count_roots, real_roots)", () => {
  const cases = buildCases();
  const { cases: answers, digits } = askSympy(cases);

  it.each(cases.map((c, i) => [c.name, i] as const))("%s", (_name, i) => {
    const { p, intervals } = cases[i];
    const answer = answers[i];
    const ivs = isolateRealRoots(p);
    expect(ivs).toHaveLength(answer.count);
    expect(countRealRootsSturm(p)).toBe(answer.count);
    intervals.forEach(([a, b], k) => expect(countRealRootsSturm(p, a, b)).toBe(answer.counts[k]));
    if (!answer.roots) return;
    // SymPy lists each root as often as its multiplicity, increasing.
    const expanded = ivs.flatMap((iv) => Array(iv.multiplicity).fill(iv));
    expect(expanded).toHaveLength(answer.roots.length);
    answer.roots.forEach(([exact, decimal], k) => {
      const iv = expanded[k];
      if (exact !== null) expect(compareRootWithRational(p, iv, parseRational(exact)!)).toBe(0);
      const tight = refineRootInterval(p, iv, { width: q(1, 10n ** 28n) });
      const d = parseRational(decimal)!; // 30 significant digits
      const scale = q(1, 10n ** 26n);
      expect(compare(sub(tight.lo, d), scale)).toBeLessThan(1);
      expect(compare(sub(d, tight.hi), scale)).toBeLessThan(1);
    });
  });

  it("refinement to 1000 digits agrees with SymPy's N(·, 1010) for √2 and the real root of x^5 - x - 1", () => {
    for (const [name, p] of [["sqrt2", [-2n, 0n, 1n]], ["x5", [-1n, -1n, 0n, 0n, 0n, 1n]]] as const) {
      const [iv] = isolateRealRoots(p, { positiveOnly: true });
      const tight = refineRootInterval(p, iv, { width: q(1, 10n ** 1000n) });
      const d = parseRational(digits[name])!; // 1010 significant digits, |error| < 10^-1008
      const slack = q(1, 10n ** 1000n);
      expect(compare(sub(tight.lo, d), slack)).toBeLessThan(1);
      expect(compare(sub(d, tight.hi), slack)).toBeLessThan(1);
    }
  });
});
