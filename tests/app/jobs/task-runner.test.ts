import { getPriority } from "node:os";
import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { decodeImageBatch, imageModPrime, liftPrimes, multiModularInput } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";
import { JOB_NICENESS } from "~/jobs/run-child.server";
import { TaskRunner } from "~/jobs/task-runner.server";
import { katsura } from "../../fixtures/algebra/systems";

describe("TaskRunner", () => {
  it("computes images in a process below the worker's priority, and sends later ones as residues on the earlier", async () => {
    const R = new PolynomialRing(katsura(4).vars, QQ, "grevlex");
    const input = multiModularInput(katsura(4).polys.map((s) => R.parse(s)));
    const [p, q, r] = [...liftPrimes(input)].slice(0, 3);
    const runner = new TaskRunner();
    try {
      const first = await runner.run({ kind: "image", runId: "run-1", input, primes: [p], deadline: Date.now() + 60_000 });
      // Algebra yields to page views on the same cores, as a job process does.
      expect(getPriority(runner.pid!)).toBe(Math.min(19, getPriority() + JOB_NICENESS));
      const later = await runner.run({ kind: "image", runId: "run-1", input, primes: [q, r], deadline: Date.now() + 60_000 });
      if (first.kind !== "image" || later.kind !== "image") throw new Error(`unexpected replies ${first.kind}, ${later.kind}`);
      const [a] = decodeImageBatch(first.bytes);
      const [b, c] = decodeImageBatch(later.bytes, (x) => (x === a.p ? a : undefined));
      // The same images as computed here, the later ones without their exponents.
      for (const [got, prime] of [[a, p], [b, q], [c, r]] as const) {
        const want = imageModPrime(input, prime, new Limits());
        expect([got.p, [...got.coeffs], [...got.exps]]).toEqual([want.p, [...want.coeffs], [...want.exps]]);
      }
      expect(later.bytes.byteLength).toBeLessThan(first.bytes.byteLength);
    } finally {
      runner.kill();
    }
  }, 60_000);
});
