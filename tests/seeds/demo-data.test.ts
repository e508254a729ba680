import { describe, expect, it } from "vitest";
import { DEMO_NETWORKS } from "../../seeds/demo-data";
import { claimsInText, demoProblems } from "../support/demo-claims";

const newest = (n: (typeof DEMO_NETWORKS)[number]) => n.versions[n.versions.length - 1]!.csv;
const textOf = (n: { name: string; description: string; tags: string[] }) => `${n.name}. ${n.description} ${n.tags.join(", ")}`;

describe("seeded demo networks say only what the engine finds", () => {
  it.each(DEMO_NETWORKS.map((n) => [n.name, n] as const))("%s", (_name, n) => {
    expect(demoProblems({ name: n.name, text: textOf(n), csv: newest(n), claims: n.claims })).toEqual([]);
  });

  it("the check catches the old switch demo: deficiency zero and weakly reversible as modelled", () => {
    const n = DEMO_NETWORKS.find((d) => d.name === "Autocatalytic switch")!;
    const old = { name: n.name, text: textOf({ ...n, description: n.previousDescriptions![0]! }), csv: n.versions[0]!.csv };
    expect(demoProblems(old)).toEqual([
      "Autocatalytic switch: the text speaks of a switch or several steady states, but the network is deficiency zero and weakly reversible (exactly one positive steady state per class, Feinberg 1987)",
      "Autocatalytic switch: the text speaks of steady states but the demo carries no steady-state claim to check",
    ]);
  });

  it("reads the claims a text makes in words", () => {
    expect(claimsInText("has three positive steady states; a bistable switch")).toEqual({ count: 3, switching: true });
    expect(claimsInText("Deficiency 0, not weakly reversible.")).toEqual({ switching: false, deficiency: 0, weaklyReversible: false });
    expect(claimsInText("A substrate switched between two forms").switching).toBe(false);
  });
});
