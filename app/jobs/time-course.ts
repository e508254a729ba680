/**
 * Time courses of the mass-action ODEs with numeric rate constants, for the "does the trajectory
 * settle?" check: dx/dt = Σ_j (y'_j − y_j) k_j Π_s x_s^{y_js} (Horn & Jackson 1972, eq. 2.5),
 * integrated by domain/numeric's Rosenbrock method of order 2(3) (Shampine & Reichelt, SIAM J. Sci. Comput. 18, 1997).
 */
import { integrateStiff } from "@domain/numeric/index";
import type { Network } from "@domain/network/index";
import type { AnalysisProgress } from "@domain/steady-state/index";

export interface MassActionFloat {
  f: (x: number[]) => number[];
  jacobian: (x: number[]) => number[][];
}

/** Floating-point right-hand side and Jacobian; throws when a rate constant has no value. */
export function massActionFloat(network: Network): MassActionFloat {
  const n = network.species.length;
  const idx = new Map(network.species.map((s, i) => [s, i]));
  const reactions = network.reactions.map((r) => {
    if (!r.rateValue) throw new Error(`The time course needs a value for every rate constant; ${r.rate} has none.`);
    const k = Number(r.rateValue.num) / Number(r.rateValue.den);
    const reactant = Object.entries(r.reactant).map(([s, a]) => [idx.get(s)!, a] as const);
    const change = new Array<number>(n).fill(0);
    for (const [s, a] of Object.entries(r.reactant)) change[idx.get(s)!] -= a;
    for (const [s, b] of Object.entries(r.product)) change[idx.get(s)!] += b;
    return { k, reactant, change };
  });
  return {
    f(x) {
      const out = new Array<number>(n).fill(0);
      for (const r of reactions) {
        let rate = r.k;
        for (const [s, a] of r.reactant) rate *= x[s] ** a;
        for (let s = 0; s < n; s++) if (r.change[s] !== 0) out[s] += r.change[s] * rate;
      }
      return out;
    },
    jacobian(x) {
      const J = Array.from({ length: n }, () => new Array<number>(n).fill(0));
      for (const r of reactions) {
        for (const [t, a] of r.reactant) {
          let d = r.k * a * x[t] ** (a - 1);
          for (const [s, b] of r.reactant) if (s !== t) d *= x[s] ** b;
          for (let s = 0; s < n; s++) if (r.change[s] !== 0) J[s][t] += r.change[s] * d;
        }
      }
      return J;
    },
  };
}

/** At most `max` samples, evenly spread over the accepted steps (first and last kept). */
function thin<T>(items: T[], max: number): T[] {
  if (items.length <= max) return items;
  const out: T[] = [];
  for (let i = 0; i < max; i++) out.push(items[Math.round((i * (items.length - 1)) / (max - 1))]);
  return out;
}

export function simulateTimeCourse(
  network: Network,
  initial: Record<string, string>,
  endTime: number,
  options: { engineTimeoutMs: number; onProgress?: (p: AnalysisProgress) => void },
): Record<string, unknown> {
  const system = massActionFloat(network);
  const y0 = network.species.map((s) => {
    const [num, den] = (initial[s] ?? "0").split("/");
    return Number(num) / (den === undefined ? 1 : Number(den));
  });
  const deadline = Date.now() + options.engineTimeoutMs;
  let last = 0;
  let stoppedByTime = false;
  const course = integrateStiff(system, y0, 0, endTime, {
    rtol: 1e-6,
    atol: 1e-10,
    maxSteps: 200_000,
    onStep(t) {
      const now = Date.now();
      if (now > deadline) {
        stoppedByTime = true;
        return false;
      }
      if (now - last > 250) {
        last = now;
        options.onProgress?.({ phase: "time-course", message: `t = ${t.toPrecision(4)} of ${endTime}` });
      }
    },
  });
  const samples = thin(course.t.map((t, i) => ({ t, y: course.y[i] })), 400);
  return {
    species: [...network.species],
    endTime,
    completed: course.completed && !stoppedByTime,
    note: stoppedByTime ? "stopped at the time limit before the end time" : course.completed ? null : "the integrator stopped early (step size underflow or step limit)",
    method: "Rosenbrock method of order 2(3) (Shampine & Reichelt, SIAM J. Sci. Comput. 18, 1997); rtol 1e-6, atol 1e-10",
    t: samples.map((s) => s.t),
    y: samples.map((s) => s.y),
  };
}
