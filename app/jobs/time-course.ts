/**
 * Time courses of the mass-action ODEs with numeric rate constants, for the "does the trajectory
 * settle?" check: dx/dt = Σ_j (y'_j − y_j) k_j Π_s x_s^{y_js} (Horn & Jackson 1972, eq. 2.5),
 * integrated by domain/numeric's Rosenbrock method of order 2(3) (Shampine & Reichelt, SIAM J. Sci. Comput. 18, 1997).
 */
import { integrateStiff } from "@domain/numeric/index";
import type { Network } from "@domain/network/index";
import type { AnalysisProgress } from "@domain/steady-state/index";
import { kineticsRing, massActionOdes } from "@domain/steady-state/kinetics";
import { floatSystem } from "@domain/steady-state/float-eval";

export interface MassActionFloat {
  f: (x: number[]) => number[];
  jacobian: (x: number[]) => number[][];
}

/**
 * Floating-point right-hand side and Jacobian, compiled from the domain's exact mass-action ODEs
 * (one builder for every consumer, so constant species are honoured the same way: a held
 * concentration multiplies the rate constant). Throws when a rate constant or a constant
 * species has no value.
 */
export function massActionFloat(network: Network): MassActionFloat {
  const kin = kineticsRing(network);
  if (kin.rateParameters.length > 0) {
    const held = new Set((network.constants ?? []).map((c) => c.name));
    const rates = kin.rateParameters.filter((p) => !held.has(p));
    const constants = kin.rateParameters.filter((p) => held.has(p));
    throw new Error(
      `The time course needs a value for every rate constant and constant species; ${[
        ...(rates.length > 0 ? [`rate constant${rates.length === 1 ? "" : "s"} ${rates.join(", ")}`] : []),
        ...(constants.length > 0 ? [`constant species ${constants.join(", ")}`] : []),
      ].join(" and ")} ${kin.rateParameters.length === 1 ? "has" : "have"} none.`,
    );
  }
  const system = floatSystem(massActionOdes(network, kin), kin.species.map((_, i) => i));
  return { f: (x) => system.values(x), jacobian: (x) => system.jacobian(x) };
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
