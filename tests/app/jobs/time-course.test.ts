import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { massActionFloat, simulateTimeCourse } from "~/jobs/time-course";

// Schlögl's fed switch (Z. Physik 253, 1972) with A = 2, B = 3 held constant:
// dX/dt = −X³ + 6X² − 11X + 6 = −(X − 1)(X − 2)(X − 3) (expanded by hand).
const FED = "# constant: A = 2, B = 3\nreaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,k1,k2,3,1\nX <-> B,k3,k4,11,2\n";

describe("time courses with constant species", () => {
  it("the held concentrations multiply the rate constants", () => {
    const system = massActionFloat(parseNetworkCsv(FED));
    expect(system.f([0])).toEqual([6]);
    expect(system.f([4])[0]).toBeCloseTo(-(3 * 2 * 1) * 1, 12);
    expect(system.jacobian([2])[0][0]).toBeCloseTo(1, 12);
  });

  it("trajectories settle on the stable state of their side of the unstable one", () => {
    const end = (x0: string) => {
      const c = simulateTimeCourse(parseNetworkCsv(FED), { X: x0 }, 20, { engineTimeoutMs: 10_000 }) as { y: number[][]; species: string[] };
      expect(c.species).toEqual(["X"]);
      return c.y[c.y.length - 1]![0]!;
    };
    expect(end("1.9")).toBeCloseTo(1, 5);
    expect(end("2.1")).toBeCloseTo(3, 5);
  });

  it("a symbolic constant concentration is refused with its name", () => {
    expect(() => massActionFloat(parseNetworkCsv(FED.replace("B = 3", "B")))).toThrow(
      "The time course needs a value for every rate constant and constant species; constant species B has none.",
    );
    expect(() => massActionFloat(parseNetworkCsv("reaction,rate\nA -> B,k\n"))).toThrow(/rate constant k has none/);
  });
});
