import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, groebnerBasis, saturate } from "@domain/algebra/index";

// Steady-state equations left after linear elimination of C in the invented network
//   C + 2D <-> 2B (1, 1/2); 2B + C <-> 2A + D (3/2, 2); A + B + D <-> 0 (1/2, 3); 2A + B -> B (2); A + C <-> 0 (5, 2),
// saturated by the species product times C's pivot: the modular replay's integer coefficients
// double in size with every reduction (10^5 digits within seconds), so single gcds and reduction
// steps take seconds. Before deadline checks inside those, a 5 s deadline ran for 10 s or more.
const R = new PolynomialRing(["D", "B", "A"], QQ, "lex");
const remaining = [
  "2*D^3*B*A + 24*D^3*A^2 + 4*D^2 + 3*D*B^3*A + 10*D*B*A^2 + 40*D*A^3 - 9*B^4 - 20*B^2*A - 30*B^2 - 60*A",
  "2*D^3*B*A - 32*D^3*A^2 - 28*D^2 + 3*D*B^3*A + 10*D*B*A^2 - 80*D*A^3 + 12*B^4 + 20*B^2*A + 6*B^2 - 60*A",
  "2*D^3*B*A + 16*D^3*A^2 + 16*D^2*B*A^2 - 20*D^2 + 3*D*B^3*A + 10*D*B*A^2 + 120*D*A^3 - 6*B^4 + 24*B^3*A^2 + 10*B^2*A - 54*B^2 + 80*B*A^3 - 60*A",
].map((s) => R.parse(s));
const pivotTimesSpecies = R.parse("2*D^3*B*A + 3*D*B^3*A + 10*D*B*A^2");

function timed(run: () => unknown): { error: unknown; elapsed: number } {
  const start = Date.now();
  try {
    run();
    return { error: undefined, elapsed: Date.now() - start };
  } catch (error) {
    return { error, elapsed: Date.now() - start };
  }
}

describe("deadlines inside long reductions", () => {
  it("a saturation with exploding coefficients stops with 'timeout' soon after its deadline", () => {
    const deadlineMs = 3000;
    // method 'modular': the traced run on F itself ('auto' now homogenises this input and finishes
    // in about a second, groebner/homogenise.ts), whose replay is the long reduction under test.
    const { error, elapsed } = timed(() => saturate(remaining, pivotTimesSpecies, { timeoutMs: deadlineMs, method: "modular" }));
    expect(error).toBeInstanceOf(AlgebraError);
    expect((error as AlgebraError).code).toBe("timeout");
    // Loose on purpose (a busy machine); measured here: within a few ms of the deadline.
    expect(elapsed).toBeLessThan(deadlineMs * 3 + 2000);
  });

  it("an absolute deadline and an AbortSignal are honoured the same way", () => {
    const deadline = Date.now() + 1000;
    const byDeadline = timed(() => saturate(remaining, pivotTimesSpecies, { deadline, method: "modular" }));
    expect((byDeadline.error as AlgebraError).code).toBe("timeout");
    expect(byDeadline.elapsed).toBeLessThan(1000 * 3 + 2000);

    const cancelled = timed(() => groebnerBasis(remaining, { signal: AbortSignal.abort() }));
    expect((cancelled.error as AlgebraError).code).toBe("cancelled");
  });
});
