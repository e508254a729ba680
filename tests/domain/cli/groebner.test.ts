import { afterEach, describe, expect, it, vi } from "vitest";

/**
 * `groebner` without `--timeout` still has a time limit (issue 16 #1: an unlucky unit ideal from
 * a fuzzer ran past 120 s). The engine is replaced by a recorder so no slow input is needed.
 */
const seen: { timeoutMs?: number }[] = [];
vi.mock("@domain/algebra/groebner", async (importOriginal) => {
  const real = await importOriginal<typeof import("@domain/algebra/groebner")>();
  return { ...real, groebnerBasis: (polys: never, options: { timeoutMs?: number }) => (seen.push(options), real.groebnerBasis(polys, options)) };
});

describe("cli groebner time limit", () => {
  afterEach(() => void (seen.length = 0));
  const SYS = "vars: x, y\nx^2 - y\n";

  it("defaults to DEFAULT_TIMEOUT_SECONDS and honours --timeout", async () => {
    const { DEFAULT_TIMEOUT_SECONDS, run } = await import("@domain/cli/groebner");
    const io = { readFile: () => SYS, stdout: () => {}, stderr: () => {} };
    run(["s"], io);
    expect(DEFAULT_TIMEOUT_SECONDS).toBeGreaterThan(0);
    expect(seen.at(-1)!.timeoutMs).toBe(DEFAULT_TIMEOUT_SECONDS * 1000);
    run(["s", "--timeout", "2.5"], io);
    expect(seen.at(-1)!.timeoutMs).toBe(2500);
    expect(() => run(["s", "--timeout", "Infinity"], io)).toThrow(/positive number of seconds/);
  });
});
