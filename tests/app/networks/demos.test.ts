import { describe, expect, it } from "vitest";
import { DEMO_NETWORKS } from "~/networks/demos";
import { demoProblems } from "../../support/demo-claims";

describe("editor demos say only what the engine finds", () => {
  it.each(DEMO_NETWORKS.map((d) => [d.title, d] as const))("%s", (_title, d) => {
    expect(demoProblems({ name: d.title, text: `${d.title}. ${d.summary}`, csv: d.csv, claims: d.claims })).toEqual([]);
  });
});
