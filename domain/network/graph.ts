/** A directed graph on vertices 0..n−1 given by its edges. */
export interface DirectedGraph {
  readonly vertices: number;
  readonly edges: readonly (readonly [number, number])[];
}

/**
 * Connected components of the underlying undirected graph (the linkage classes when the vertices
 * are complexes; Feinberg 1987). Components are ordered by their smallest vertex, members increasing.
 * Example: edges 0→1, 2→3 on 4 vertices give [[0, 1], [2, 3]].
 */
export function connectedComponents(g: DirectedGraph): number[][] {
  const parent = Array.from({ length: g.vertices }, (_, i) => i);
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]];
      x = parent[x];
    }
    return x;
  };
  for (const [a, b] of g.edges) {
    const ra = find(a);
    const rb = find(b);
    if (ra !== rb) parent[Math.max(ra, rb)] = Math.min(ra, rb);
  }
  return groupBy(g.vertices, find);
}

/**
 * Strongly connected components by Tarjan's algorithm (Tarjan, "Depth-first search and linear
 * graph algorithms", SIAM J. Comput. 1 (1972)), iterative. Ordered by smallest vertex, members increasing.
 * Example: edges 0→1, 1→0, 1→2 give [[0, 1], [2]].
 */
export function stronglyConnectedComponents(g: DirectedGraph): number[][] {
  const adj: number[][] = Array.from({ length: g.vertices }, () => []);
  for (const [a, b] of g.edges) adj[a].push(b);
  const index = new Array<number>(g.vertices).fill(-1);
  const low = new Array<number>(g.vertices).fill(0);
  const onStack = new Array<boolean>(g.vertices).fill(false);
  const component = new Array<number>(g.vertices).fill(-1);
  const stack: number[] = [];
  let counter = 0;
  let components = 0;
  for (let root = 0; root < g.vertices; root++) {
    if (index[root] !== -1) continue;
    const work: [number, number][] = [[root, 0]];
    index[root] = low[root] = counter++;
    stack.push(root);
    onStack[root] = true;
    while (work.length > 0) {
      const frame = work[work.length - 1];
      const [v, k] = frame;
      if (k < adj[v].length) {
        frame[1]++;
        const w = adj[v][k];
        if (index[w] === -1) {
          index[w] = low[w] = counter++;
          stack.push(w);
          onStack[w] = true;
          work.push([w, 0]);
        } else if (onStack[w]) low[v] = Math.min(low[v], index[w]);
        continue;
      }
      work.pop();
      if (work.length > 0) {
        const u = work[work.length - 1][0];
        low[u] = Math.min(low[u], low[v]);
      }
      if (low[v] === index[v]) {
        let w: number;
        do {
          w = stack.pop()!;
          onStack[w] = false;
          component[w] = components;
        } while (w !== v);
        components++;
      }
    }
  }
  return groupBy(g.vertices, (v) => component[v]);
}

/**
 * The strongly connected components with no edge leaving them: the terminal strong linkage
 * classes (Feinberg 1987). Example: edges 0→1, 1→0, 1→2 give [[2]].
 */
export function terminalComponents(g: DirectedGraph, sccs: readonly (readonly number[])[]): number[][] {
  const of = new Array<number>(g.vertices);
  sccs.forEach((c, k) => c.forEach((v) => (of[v] = k)));
  const leaves = new Set<number>();
  for (const [a, b] of g.edges) if (of[a] !== of[b]) leaves.add(of[a]);
  return sccs.filter((_, k) => !leaves.has(k)).map((c) => [...c]);
}

function groupBy(n: number, key: (v: number) => number): number[][] {
  const groups = new Map<number, number[]>();
  for (let v = 0; v < n; v++) {
    const k = key(v);
    if (!groups.has(k)) groups.set(k, []);
    groups.get(k)!.push(v);
  }
  return [...groups.values()].sort((a, b) => a[0] - b[0]);
}
