import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import type { DistributedRunView } from "~/analyses/distributed-runs.server";
import { DistributedRuns } from "~/analyses/ui/distributed-runs";

const run = (over: Partial<DistributedRunView>): DistributedRunView => ({
  id: "r", status: "succeeded", imagesDone: 29, imagesNeeded: 29, primesUsed: Array.from({ length: 27 }, (_, i) => 2097143 - 2 * i), unluckyPrimes: [], declinedPrimes: [],
  proofDone: 9, proofBatches: 9, workers: ["vm:11:a", "vm:12:b"], workerCount: 2, engineVersion: "0.1.0+test", error: null, insteadBy: null, ...over,
});

describe("the analysis page's panel of distributed bases (server render)", () => {
  it("shows images done and needed, proof batches, the workers, primes and engine; a run not used says what replaced it", () => {
    const html = renderToStaticMarkup(createElement(DistributedRuns, {
      runs: [
        run({ id: "f", status: "failed", imagesDone: 1, imagesNeeded: null, primesUsed: [], proofDone: 1, proofBatches: 1, workers: ["vm:11:a"], workerCount: 1, error: "proof step failed: hilbert (checked on the first image, before lifting)", insteadBy: "later run" }),
        run({ id: "fh" }),
        run({ id: "d", unluckyPrimes: [2097013], declinedPrimes: [2097023, 2096993] }),
      ],
    }));
    expect(html.match(/data-testid="distributed-run"/g) ?? []).toHaveLength(3);
    expect(html).toContain("1 image done of at least 2 needed");
    expect(html).toContain("not used: proof step failed: hilbert (checked on the first image, before lifting); its homogenised ideal was spread instead (next line)");
    expect(html).toContain("29 images done of 29 needed");
    expect(html).toContain("proof 9 of 9 batches");
    expect(html).toContain("proven");
    expect(html).toContain("2 workers: vm:11:a, vm:12:b");
    expect(html).toContain("27 primes lifted; engine 0.1.0+test");
    expect(html).toContain("27 primes lifted, 1 set aside as unlucky, 2 set aside where the replayed F4 run declined; engine");
  });

  it("on a shared view counts the workers without naming them, and says so when a run fell back to one process", () => {
    const html = renderToStaticMarkup(createElement(DistributedRuns, {
      runs: [run({ status: "failed", workers: [], workerCount: 3, error: "proof step failed: groebner", insteadBy: "one process" })],
    }));
    expect(html).toContain("3 workers");
    expect(html).not.toContain("vm:");
    expect(html).toContain("not used: proof step failed: groebner; computed in one process instead");
  });

  it("draws nothing when no basis was spread", () => {
    expect(renderToStaticMarkup(createElement(DistributedRuns, { runs: [] }))).toBe("");
  });
});
