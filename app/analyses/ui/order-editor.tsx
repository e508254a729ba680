import { useState } from "react";

/**
 * The elimination order as a list to rearrange: drag a species, or use the ↑/↓ buttons (keyboard
 * and screen-reader friendly). The first species is eliminated first; free species go last.
 * Submits as one hidden `order` field (comma-separated).
 */
export function OrderEditor({ suggested, reason, initial }: { suggested: string[]; reason: string; initial?: string[] }) {
  const [order, setOrder] = useState(initial ?? suggested);
  const [dragging, setDragging] = useState<number | null>(null);
  const move = (from: number, to: number) => {
    if (to < 0 || to >= order.length || from === to) return;
    const next = [...order];
    const [item] = next.splice(from, 1);
    next.splice(to, 0, item!);
    setOrder(next);
  };
  const changed = order.join(",") !== suggested.join(",");
  return (
    <div className="space-y-2">
      <input type="hidden" name="order" value={changed ? order.join(",") : ""} />
      <p className="text-sm text-muted">
        Suggested order: <span className="font-mono text-ink">{suggested.join(" > ")}</span> — {reason}.
      </p>
      <ol className="max-w-sm space-y-1" data-testid="order-list" aria-label="Elimination order, first eliminated first">
        {order.map((s, i) => (
          <li
            key={s}
            draggable
            onDragStart={() => setDragging(i)}
            onDragOver={(e) => e.preventDefault()}
            onDrop={() => {
              if (dragging !== null) move(dragging, i);
              setDragging(null);
            }}
            className={`flex cursor-grab items-center gap-2 rounded-md border border-line bg-surface px-3 py-1.5 text-sm ${dragging === i ? "opacity-50" : ""}`}
            data-testid="order-item"
          >
            <span className="w-5 text-right tabular-nums text-faint">{i + 1}.</span>
            <span className="flex-1 font-mono">{s}</span>
            <button type="button" className="rounded-sm px-1.5 text-muted hover:bg-sunken disabled:opacity-30" onClick={() => move(i, i - 1)} disabled={i === 0} aria-label={`Move ${s} up`}>
              ↑
            </button>
            <button type="button" className="rounded-sm px-1.5 text-muted hover:bg-sunken disabled:opacity-30" onClick={() => move(i, i + 1)} disabled={i === order.length - 1} aria-label={`Move ${s} down`}>
              ↓
            </button>
          </li>
        ))}
      </ol>
      {changed && (
        <button type="button" className="text-sm text-accent-strong hover:underline" onClick={() => setOrder(suggested)}>
          Back to the suggested order
        </button>
      )}
    </div>
  );
}
