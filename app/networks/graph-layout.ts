import dagre from "@dagrejs/dagre";
import type { NetworkStructure } from "@domain/network/index";
import { LruMap } from "~/components/render-cache";

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

const MAX_WIDTH = 1000;
const BAND_GAP = 36;

const textWidth = (s: string) => Math.ceil(s.length * CHAR_WIDTH);

type Pair = { a: number; b: number; ab: string[]; ba: string[] };

function layoutClass(members: string[], classEdges: Pair[], index: Map<string, number>) {
  const g = new dagre.graphlib.Graph();
  g.setGraph({ rankdir: "LR", nodesep: 26, ranksep: 64, edgesep: 14, marginx: 0, marginy: 0 });
  g.setDefaultEdgeLabel(() => ({}));
  for (const name of members) g.setNode(String(index.get(name)), { width: textWidth(name) + 24, height: NODE_HEIGHT });
  for (const p of classEdges) {
    // Draw along the written direction when only one exists.
    const [from, to, fwd, back] = p.ab.length > 0 ? [p.a, p.b, p.ab, p.ba] : [p.b, p.a, p.ba, p.ab];
    const label = back.length > 0 ? `${fwd.join(", ")} ⇄ ${back.join(", ")}` : fwd.join(", ");
    g.setEdge(String(from), String(to), { width: textWidth(label) + 8, height: LABEL_HEIGHT, labelpos: "c", label });
  }
  dagre.layout(g);
  return g;
}

const layouts = new LruMap<ComplexGraphLayout>(500);

/** The layout of a network's complex graph; dagre's work is remembered by the graph it was given. */
export function layoutComplexGraph(structure: Pick<NetworkStructure, "complexes" | "reactionList" | "linkageClassMembers">): ComplexGraphLayout {
  const key = JSON.stringify([structure.complexes, structure.reactionList.map((r) => [r.reactant, r.product, r.rate]), structure.linkageClassMembers]);
  return layouts.getOrCompute(key, () => computeLayout(structure));
}

function computeLayout(structure: Pick<NetworkStructure, "complexes" | "reactionList" | "linkageClassMembers">): ComplexGraphLayout {
  const index = new Map(structure.complexes.map((c, i) => [c, i]));
  // Unordered pairs → rates in each direction.
  const pairs = new Map<string, Pair>();
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
    const classEdges = [...pairs.values()].filter((p) => classOf.get(p.a) === k);
    // Left to right reads like a reaction scheme; a class wider than the page wraps into bands,
    // like lines of text, and an arrow running from one band to the next is drawn straight.
    const g = layoutClass(members, classEdges, index);
    const graph = g.graph() as { width?: number; height?: number };
    const fullW = graph.width ?? 0;
    const bandH = (graph.height ?? 0) + BAND_GAP;
    const bands = Math.max(1, Math.ceil(fullW / MAX_WIDTH));
    const bandW = fullW / bands;
    const bandOf = (x: number) => Math.min(bands - 1, Math.floor(x / bandW));
    // Each band starts at its leftmost box, so no box hangs over the frame.
    const bandLeft = new Array<number>(bands).fill(Infinity);
    for (const id of g.nodes()) {
      const n = g.node(id) as { x: number; width: number };
      bandLeft[bandOf(n.x)] = Math.min(bandLeft[bandOf(n.x)]!, n.x - n.width / 2);
    }
    const place = (pt: { x: number; y: number }, band: number) => ({
      x: pt.x - (Number.isFinite(bandLeft[band]!) ? bandLeft[band]! : 0) + FRAME_PAD,
      y: pt.y + band * bandH + top + FRAME_PAD + FRAME_TITLE,
    });
    const placed = new Map<string, LaidOutNode>();
    let innerW = 0;
    for (const id of g.nodes()) {
      const n = g.node(id) as { x: number; y: number; width: number; height: number };
      const at = place(n, bandOf(n.x));
      const node = { id: Number(id), label: structure.complexes[Number(id)]!, x: at.x, y: at.y, width: n.width, height: n.height, linkageClass: k };
      innerW = Math.max(innerW, at.x - FRAME_PAD + n.width / 2);
      placed.set(id, node);
      nodes.push(node);
    }
    const innerH = bands * bandH - BAND_GAP;
    for (const e of g.edges()) {
      const l = g.edge(e) as { points: { x: number; y: number }[]; x: number; y: number; label: string };
      const from = Number(e.v);
      const to = Number(e.w);
      const p = pairs.get(from < to ? `${from}-${to}` : `${to}-${from}`)!;
      const [a, b] = [placed.get(e.v)!, placed.get(e.w)!];
      const sameBand = bandOf((g.node(e.v) as { x: number }).x) === bandOf((g.node(e.w) as { x: number }).x);
      const band = bandOf((g.node(e.v) as { x: number }).x);
      const points = sameBand
        ? l.points.map((pt) => place(pt, band))
        : [
            { x: a.x, y: a.y + a.height / 2 },
            { x: b.x, y: b.y - b.height / 2 },
          ];
      const labelAt = sameBand ? place({ x: l.x, y: l.y }, band) : { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
      edges.push({ from, to, twoWay: p.ab.length > 0 && p.ba.length > 0, label: l.label, points, labelAt, linkageClass: k });
      for (const pt of points) innerW = Math.max(innerW, pt.x - FRAME_PAD);
      innerW = Math.max(innerW, labelAt.x - FRAME_PAD + textWidth(l.label) / 2);
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
