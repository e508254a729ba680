import type { ComplexGraphLayout, LaidOutEdge } from "../graph-layout";

/** One hue per linkage class, calm and distinguishable (cycled beyond six). */
const CLASS_COLOURS = ["#2c6b66", "#a86a12", "#6b4c8a", "#3b6397", "#7a6a2c", "#9e3a36"];
export const classColour = (k: number) => CLASS_COLOURS[k % CLASS_COLOURS.length]!;

function pathOf(e: LaidOutEdge): string {
  const [first, ...rest] = e.points;
  if (!first) return "";
  if (rest.length === 0) return `M${first.x},${first.y}`;
  // Smooth through dagre's bend points with quadratic segments between midpoints.
  let d = `M${first.x},${first.y}`;
  for (let i = 0; i < rest.length - 1; i++) {
    const p = rest[i]!;
    const q = rest[i + 1]!;
    d += ` Q${p.x},${p.y} ${(p.x + q.x) / 2},${(p.y + q.y) / 2}`;
  }
  const last = rest[rest.length - 1]!;
  return `${d} L${last.x},${last.y}`;
}

/** The complex graph as SVG: complexes as boxes, reactions as arrows, one frame per linkage class. */
export function ComplexGraph({ layout, title }: { layout: ComplexGraphLayout; title: string }) {
  const pad = 4;
  return (
    <svg
      role="img"
      aria-label={title}
      data-testid="complex-graph"
      viewBox={`${-pad} ${-pad} ${layout.width + 2 * pad} ${layout.height + 2 * pad}`}
      width={layout.width + 2 * pad}
      height={layout.height + 2 * pad}
      className="max-w-full"
      style={{ fontFamily: "var(--font-sans)" }}
    >
      <defs>
        {layout.classes.map((c) => (
          <marker key={c.index} id={`arrow-${c.index}`} viewBox="0 0 10 10" refX="9" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
            <path d="M0,0 L10,5 L0,10 z" fill={classColour(c.index)} />
          </marker>
        ))}
      </defs>
      {layout.classes.map((c) => (
        <g key={c.index} data-testid="linkage-class-frame">
          <rect x={c.x} y={c.y} width={c.width} height={c.height} rx={10} fill={classColour(c.index)} fillOpacity={0.05} stroke={classColour(c.index)} strokeOpacity={0.45} strokeDasharray="4 3" />
          <text x={c.x + 12} y={c.y + 17} fontSize={12} fill={classColour(c.index)} fontWeight={600}>
            Linkage class {c.index + 1}
          </text>
        </g>
      ))}
      {layout.edges.map((e, i) => (
        <g key={i}>
          <path
            d={pathOf(e)}
            fill="none"
            stroke={classColour(e.linkageClass)}
            strokeWidth={1.5}
            markerEnd={`url(#arrow-${e.linkageClass})`}
            markerStart={e.twoWay ? `url(#arrow-${e.linkageClass})` : undefined}
          />
          <text x={e.labelAt.x} y={e.labelAt.y - 5} fontSize={11} textAnchor="middle" fill="var(--color-muted)" paintOrder="stroke" stroke="var(--color-surface)" strokeWidth={3}>
            {e.label}
          </text>
        </g>
      ))}
      {layout.nodes.map((n) => (
        <g key={n.id} data-testid="complex-node">
          <rect x={n.x - n.width / 2} y={n.y - n.height / 2} width={n.width} height={n.height} rx={6} fill="var(--color-surface)" stroke={classColour(n.linkageClass)} strokeWidth={1.5} />
          <text x={n.x} y={n.y + 4.5} fontSize={13} textAnchor="middle" fill="var(--color-ink)">
            {n.label}
          </text>
        </g>
      ))}
    </svg>
  );
}
