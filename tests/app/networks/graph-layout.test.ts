import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { layoutComplexGraph, type LaidOutNode } from "~/networks/graph-layout";

const s = (csv: string) => analyseStructure(parseNetworkCsv(csv));
const overlap = (a: LaidOutNode, b: LaidOutNode) => Math.abs(a.x - b.x) * 2 < a.width + b.width && Math.abs(a.y - b.y) * 2 < a.height + b.height;

describe("layoutComplexGraph", () => {
  it("remembers the layout of a graph it has laid out, and lays out a changed graph afresh", () => {
    const csv = "reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n";
    const first = layoutComplexGraph(s(csv));
    // A structure computed again from the same file is a new object with the same graph.
    expect(layoutComplexGraph(s(csv))).toBe(first);
    const renamed = layoutComplexGraph(s(csv.replace("k3", "k9")));
    expect(renamed).not.toBe(first);
    expect(renamed.edges.map((e) => e.label)).toContain("k9");
  });

  it("draws one node per complex and one line per reaction pair, two-way for reversible pairs", () => {
    const layout = layoutComplexGraph(s("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n"));
    expect(layout.nodes.map((n) => n.label).sort()).toEqual(["C", "E + P", "E + S"]);
    expect(layout.edges.map((e) => [e.label, e.twoWay])).toEqual([
      ["k1 ⇄ k2", true],
      ["k3", false],
    ]);
    expect(layout.classes).toHaveLength(1);
  });

  it("puts each linkage class in its own frame, stacked without overlap", () => {
    const layout = layoutComplexGraph(s("reaction\nA <-> B\nC -> D\n0 -> E\n"));
    expect(layout.classes).toHaveLength(3);
    for (let k = 1; k < layout.classes.length; k++) {
      expect(layout.classes[k]!.y).toBeGreaterThanOrEqual(layout.classes[k - 1]!.y + layout.classes[k - 1]!.height);
    }
    for (const n of layout.nodes) {
      const frame = layout.classes[n.linkageClass]!;
      expect(n.y - n.height / 2).toBeGreaterThan(frame.y);
      expect(n.y + n.height / 2).toBeLessThan(frame.y + frame.height);
    }
  });

  it("keeps 40 complexes apart (no two boxes overlap) within a readable size", () => {
    // A chain of 20 reversible binding steps joined by 19 release steps: 40 complexes in one class.
    const rows = ["reaction,rate,reverse_rate"];
    for (let i = 1; i <= 20; i++) rows.push(`X${i} + Y <-> Z${i},a${i},b${i}`);
    for (let i = 1; i < 20; i++) rows.push(`Z${i} -> X${i + 1} + Y,c${i},`);
    const structure = s(rows.join("\n") + "\n");
    expect(structure.complexes.length).toBe(40);
    const layout = layoutComplexGraph(structure);
    expect(layout.nodes).toHaveLength(40);
    for (let i = 0; i < layout.nodes.length; i++) {
      for (let j = i + 1; j < layout.nodes.length; j++) expect(overlap(layout.nodes[i]!, layout.nodes[j]!)).toBe(false);
    }
    // Too long for one row: wrapped into bands that fit the page's width, not one tall strip.
    expect(layout.width).toBeLessThanOrEqual(1100);
    expect(layout.height).toBeLessThan(800);
    for (const e of layout.edges) for (const p of e.points) expect(p.x).toBeGreaterThanOrEqual(0);
  });
});
