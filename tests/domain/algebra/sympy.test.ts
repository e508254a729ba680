import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, divide, groebnerBasis, primeField } from "@domain/algebra/index";
import type { Field } from "@domain/algebra/index";
import { cyclic, katsura, prng, randInt, randomIdeal, randomPolyText } from "../../fixtures/algebra/systems";

/**
 * Checks against an outside reference: SymPy 1.11 (Debian python3-sympy) through
 * tests/fixtures/algebra/sympy_reference.py, run with /usr/bin/python3. SymPy's `groebner`
 * returns the reduced basis (made monic by the script); `reduced` divides by the list in the
 * given order with the same rule as Cox–Little–O'Shea (first divisor whose leading term divides,
 * else the leading term goes to the remainder — SymPy 1.11 `PolyElement.div`), so quotients and
 * remainders must agree exactly, not only the remainder.
 */
const PYTHON = "/usr/bin/python3";
const SCRIPT = "tests/fixtures/algebra/sympy_reference.py";

interface Task {
  op: "groebner" | "reduced";
  vars: string[];
  order: string;
  modulus: number;
  polys: string[];
  label: string;
}

function buildTasks(): Task[] {
  const tasks: Task[] = [];
  const orders = ["lex", "grlex", "grevlex"];
  let seed = 1;
  // Seeded random ideals: 2–5 variables, degrees ≤ 3 (≤ 2 from 4 variables on, to keep SymPy quick),
  // small (≤ 9) and large (≤ 10^12) coefficients, fractions over Q, all three orders, Q and Z/32003.
  for (let rep = 0; rep < 2; rep++) {
    for (let nv = 2; nv <= 5; nv++) {
      for (const order of orders) {
        for (const big of [false, true]) {
          const modulus = seed % 3 === 0 ? 32003 : 0;
          const s = randomIdeal(seed, {
            nvars: nv, npolys: nv <= 2 ? 2 : nv - 1, maxDegree: nv >= 4 ? 2 : 3, minTerms: 2, minDegree: 1, maxTerms: 3,
            coeffBound: big ? 10n ** 12n : 9n, fractions: modulus === 0,
          });
          tasks.push({ op: "groebner", vars: s.vars, order, modulus, polys: s.polys, label: `random seed ${seed} (${nv} vars, ${order}, ${modulus ? "Z/32003" : "Q"})` });
          seed++;
        }
      }
    }
  }
  // 60-digit and fractional coefficients (F4 lifts them from many primes), Q and Z/32003, all orders.
  for (let rep = 0; rep < 4; rep++) {
    for (const order of orders) {
      const modulus = rep === 3 ? 32003 : 0;
      const s = randomIdeal(500 + rep * 3 + orders.indexOf(order), {
        nvars: 3, npolys: 2, maxDegree: 2, minTerms: 2, minDegree: 1, maxTerms: 3, coeffBound: 10n ** 60n, fractions: modulus === 0,
      });
      tasks.push({ op: "groebner", vars: s.vars, order, modulus, polys: s.polys, label: `60-digit seed ${500 + rep} (${order}, ${modulus ? "Z/32003" : "Q"}, not zero-dimensional)` });
    }
  }
  // Ideals containing 1, and a non-zero-dimensional one (a line and a point).
  for (const order of orders) {
    tasks.push({ op: "groebner", vars: ["x", "y", "z"], order, modulus: 0, polys: ["x*y - 1", "x^2 - 2/3*z", "y*z - 5", "x - 7"], label: `unit ideal (${order}, Q)` });
    tasks.push({ op: "groebner", vars: ["x", "y", "z"], order, modulus: 32003, polys: ["x^2 + y - 1", "x^2 + y + 1"], label: `unit ideal (${order}, Z/32003)` });
    tasks.push({ op: "groebner", vars: ["x", "y", "z"], order, modulus: 0, polys: ["x*z - y*z", "x*y - 3/2*y", "z^2 - z*y"], label: `positive-dimensional (${order}, Q)` });
  }
  // Classic systems (katsura-4 in lex is left out: SymPy needs over a minute for it here).
  for (const sys of [katsura(3), cyclic(4)]) for (const order of orders) tasks.push({ op: "groebner", vars: sys.vars, order, modulus: 0, polys: sys.polys, label: `${sys.name} ${order}` });
  for (const order of ["grlex", "grevlex"]) tasks.push({ op: "groebner", vars: katsura(4).vars, order, modulus: 0, polys: katsura(4).polys, label: `katsura-4 ${order}` });
  // Division: random dividend and 1–3 divisors.
  const rnd = prng(777);
  for (let t = 0; t < 36; t++) {
    const nv = 2 + (t % 3);
    const vars = ["x", "y", "z"].slice(0, nv);
    const modulus = t % 4 === 3 ? 101 : 0;
    const o = { nvars: nv, npolys: 1, maxDegree: 3, maxTerms: 3, minTerms: 1, coeffBound: modulus ? 100n : t % 2 ? 10n ** 9n : 9n, fractions: modulus === 0 }; // < p: no divisor vanishes mod p
    const f = randomPolyText(rnd, vars, { ...o, maxDegree: 6, maxTerms: 7 });
    const gs = Array.from({ length: randInt(rnd, 1, 3) }, () => randomPolyText(rnd, vars, o));
    tasks.push({ op: "reduced", vars, order: orders[t % 3], modulus, polys: [f, ...gs], label: `division ${t}` });
  }
  return tasks;
}

const haveSympy = existsSync(PYTHON) && (() => {
  try {
    execFileSync(PYTHON, ["-c", "import sympy"], { stdio: "ignore" });
    return true;
  } catch {
    return false;
  }
})();

describe.runIf(haveSympy)("agreement with SymPy 1.11 (Debian python3-sympy)", () => {
  const tasks = buildTasks();
  const reference = JSON.parse(
    execFileSync(PYTHON, [SCRIPT], { input: JSON.stringify(tasks), maxBuffer: 1 << 26, timeout: 110_000 }).toString(),
  ) as { sympy: string; results: { basis?: string[]; q?: string[]; r?: string; error?: string }[] };

  it("runs SymPy 1.11", () => expect(reference.sympy).toMatch(/^1\.11/));

  tasks.forEach((task, i) => {
    it(`${task.op}: ${task.label}`, () => {
      const ref = reference.results[i];
      expect(ref.error).toBeUndefined();
      const field = (task.modulus ? primeField(task.modulus) : QQ) as Field<unknown>;
      const R = new PolynomialRing(task.vars, field, task.order);
      const polys = task.polys.map((s) => R.parse(s));
      if (task.op === "groebner") {
        // Every engine path against SymPy: the default, F4 (multi-modular over Q), traced Buchberger, plain Buchberger.
        for (const method of ["auto", "f4", "modular", "buchberger"] as const) {
          const ours = groebnerBasis(polys, { method }).map((g) => R.format(g));
          expect(new Set(ours), method).toEqual(new Set(ref.basis));
          expect(ours.length, method).toBe(ref.basis!.length);
        }
      } else {
        const { quotients, remainder } = divide(polys[0], polys.slice(1));
        expect(R.format(remainder)).toBe(ref.r);
        expect(quotients.map((q) => R.format(q))).toEqual(ref.q);
      }
    });
  });
}, 120_000);
