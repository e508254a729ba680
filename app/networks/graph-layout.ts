import dagre from "@dagrejs/dagre";
import type { NetworkStructure } from "@domain/network/index";

/**
 * Positions for drawing the complex graph (complexes as nodes, reactions as arrows). Each
 * linkage class is laid out on its own by dagre (layered drawing, left to right) and the classes
 * are stacked top to bottom, each in its own frame, so they stay apart. A reaction and its
 * reverse share one line with arrowheads at both ends. Pure; runs on the server and in the browser.
 */

export interface LaidOutNode {
  id: number;
  label: string;
  x: number;
  y: number;
  width: number;
  height: number;
  linkageClass: number;
}

export interface LaidOutEdge {
  from: number;
  to: number;
  /** Both directions present: arrowheads at both ends. */
  twoWay: boolean;
  /** `k1` or `k1 ⇄ k2` (forward along from → to, then back). */
  label: string;
  points: { x: number; y: number }[];
  labelAt: { x: number; y: number };
  linkageClass: number;
}

export interface LaidOutClass {
  index: number;
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface ComplexGraphLayout {
  width: number;
  height: number;
  nodes: LaidOutNode[];
  edges: LaidOutEdge[];
  classes: LaidOutClass[];
}

const CHAR_WIDTH = 7.4; // ~13 px Noto Sans
const NODE_HEIGHT = 30;
const LABEL_HEIGHT = 16;
const FRAME_PAD = 14;
const FRAME_TITLE = 20;
const CLASS_GAP = 18;

const textWidth = (s: string) => Math.ceil(s.length * CHAR_WIDTH);

export function layoutComplexGraph(structure: Pick<NetworkStructure, "complexes" | "reactionList" | "linkageClassMembers">): ComplexGraphLayout {
  const index = new Map(structure.complexes.map((c, i) => [c, i]));
  // Unordered pairs → rates in each direction.
  const pairs = new Map<string, { a: number; b: number; ab: string[]; ba: string[] }>();
  for (const r of structure.reactionList) {
    const u = index.get(r.reactant)!;
    const v = index.get(r.product)!;
    const [a, b] = u < v ? [u, v] : [v, u];
    const key = `${a}-${b}`;
    const pair = pairs.get(key) ?? { a, b, ab: [], ba: [] };
    (u === a ? pair.ab : pair.ba).push(r.rate);
    pairs.set(key, pair);
  }
  const classOf = new Map<number, number>();
  structure.linkageClassMembers.forEach((members, k) => members.forEach((c) => classOf.set(index.get(c)!, k)));

  const nodes: LaidOutNode[] = [];
  const edges: LaidOutEdge[] = [];
  const classes: LaidOutClass[] = [];
  let top = 0;
  let width = 0;
  structure.linkageClassMembers.forEach((members, k) => {
    const g = new dagre.graphlib.Graph();
    g.setGraph({ rankdir: "LR", nodesep: 26, ranksep: 64, edgesep: 14, marginx: 0, marginy: 0 });
    g.setDefaultEdgeLabel(() => ({}));
    for (const name of members) {
      g.setNode(String(index.get(name)), { width: textWidth(name) + 24, height: NODE_HEIGHT });
    }
    const classEdges = [...pairs.values()].filter((p) => classOf.get(p.a) === k);
    for (const p of classEdges) {
      // Draw along the written direction when only one exists.
      const [from, to, fwd, back] = p.ab.length > 0 ? [p.a, p.b, p.ab, p.ba] : [p.b, p.a, p.ba, p.ab];
      const label = back.length > 0 ? `${fwd.join(", ")} ⇄ ${back.join(", ")}` : fwd.join(", ");
      g.setEdge(String(from), String(to), { width: textWidth(label) + 8, height: LABEL_HEIGHT, labelpos: "c", label });
    }
    dagre.layout(g);
    const graph = g.graph() as { width?: number; height?: number };
    const innerW = graph.width ?? 0;
    const innerH = graph.height ?? 0;
    const ox = FRAME_PAD;
    const oy = top + FRAME_PAD + FRAME_TITLE;
    for (const id of g.nodes()) {
      const n = g.node(id) as { x: number; y: number; width: number; height: number };
      nodes.push({ id: Number(id), label: structure.complexes[Number(id)]!, x: n.x + ox, y: n.y + oy, width: n.width, height: n.height, linkageClass: k });
    }
    for (const e of g.edges()) {
      const l = g.edge(e) as { points: { x: number; y: number }[]; x: number; y: number; label: string };
      const from = Number(e.v);
      const to = Number(e.w);
      const p = pairs.get(from < to ? `${from}-${to}` : `${to}-${from}`)!;
      edges.push({
        from,
        to,
        twoWay: p.ab.length > 0 && p.ba.length > 0,
        label: l.label,
        points: l.points.map((pt) => ({ x: pt.x + ox, y: pt.y + oy })),
        labelAt: { x: l.x + ox, y: l.y + oy },
        linkageClass: k,
      });
    }
    const frameW = innerW + 2 * FRAME_PAD;
    const frameH = innerH + 2 * FRAME_PAD + FRAME_TITLE;
    classes.push({ index: k, x: 0, y: top, width: frameW, height: frameH });
    width = Math.max(width, frameW);
    top += frameH + CLASS_GAP;
  });
  for (const c of classes) c.width = width;
  return { width, height: Math.max(0, top - CLASS_GAP), nodes, edges, classes };
}
