import { describe, expect, it } from "vitest";
import { connectedComponents, stronglyConnectedComponents, terminalComponents, type DirectedGraph } from "../../../domain/network";
import { randomInt, seededRandom } from "../../support/prng";

function reachability(g: DirectedGraph): boolean[][] {
  const r = Array.from({ length: g.vertices }, (_, i) => Array.from({ length: g.vertices }, (_, j) => i === j));
  for (const [a, b] of g.edges) r[a][b] = true;
  for (let k = 0; k < g.vertices; k++)
    for (let i = 0; i < g.vertices; i++) for (let j = 0; j < g.vertices; j++) if (r[i][k] && r[k][j]) r[i][j] = true;
  return r;
}

describe("graph components", () => {
  it("small examples", () => {
    const g: DirectedGraph = { vertices: 4, edges: [[0, 1], [1, 0], [1, 2]] };
    expect(connectedComponents(g)).toEqual([[0, 1, 2], [3]]);
    expect(stronglyConnectedComponents(g)).toEqual([[0, 1], [2], [3]]);
    expect(terminalComponents(g, stronglyConnectedComponents(g))).toEqual([[2], [3]]);
  });

  it("Tarjan's components agree with mutual reachability (Warshall closure) on random graphs", () => {
    const rand = seededRandom(5);
    for (let t = 0; t < 200; t++) {
      const n = randomInt(rand, 1, 9);
      const edges: [number, number][] = [];
      const m = randomInt(rand, 0, 14);
      for (let e = 0; e < m; e++) edges.push([randomInt(rand, 0, n - 1), randomInt(rand, 0, n - 1)]);
      const g = { vertices: n, edges };
      const r = reachability(g);
      const scc = stronglyConnectedComponents(g);
      const of = new Array<number>(n);
      scc.forEach((c, k) => c.forEach((v) => (of[v] = k)));
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(of[i] === of[j]).toBe(r[i][j] && r[j][i]);
      // Terminal: nothing reachable outside the component.
      const terminal = new Set(terminalComponents(g, scc).map((c) => c[0]));
      for (const c of scc) {
        const closed = c.every((v) => r[v].every((reach, w) => !reach || of[w] === of[v]));
        expect(terminal.has(c[0])).toBe(closed);
      }
      const undirected = reachability({ vertices: n, edges: [...edges, ...edges.map(([a, b]) => [b, a] as [number, number])] });
      const cc = connectedComponents(g);
      const cof = new Array<number>(n);
      cc.forEach((c, k) => c.forEach((v) => (cof[v] = k)));
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(cof[i] === cof[j]).toBe(undirected[i][j]);
    }
  });
});
