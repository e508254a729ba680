/**
 * Memory for what every page view would otherwise recompute from the same input: KaTeX's HTML
 * for a formula (tens of milliseconds for a network's ODE block) and the complex graph's layout.
 * Both are pure functions of their input, so a hit is exactly what a fresh computation would give;
 * the maps are bounded (least recently used out first) so a server holding many networks stays small.
 * Works the same on the server and in the browser.
 */
import katex from "katex";

export class LruMap<V> {
  private readonly entries = new Map<string, V>();
  constructor(private readonly limit: number) {}

  get(key: string): V | undefined {
    const value = this.entries.get(key);
    if (value === undefined) return undefined;
    // Re-insert: Map iteration order is insertion order, so the oldest use comes first.
    this.entries.delete(key);
    this.entries.set(key, value);
    return value;
  }

  set(key: string, value: V): void {
    this.entries.delete(key);
    this.entries.set(key, value);
    while (this.entries.size > this.limit) this.entries.delete(this.entries.keys().next().value!);
  }

  get size(): number {
    return this.entries.size;
  }

  /** The cached value for `key`, computing and remembering it on a miss. */
  getOrCompute(key: string, compute: () => V): V {
    const hit = this.get(key);
    if (hit !== undefined) return hit;
    const value = compute();
    this.set(key, value);
    return value;
  }
}

const texHtml = new LruMap<string>(2000);

/** KaTeX's HTML+MathML for `tex` (errors shown in place, never thrown), remembered by its text. */
export function katexHtml(tex: string, display: boolean): string {
  return texHtml.getOrCompute(`${display ? "D" : "I"}${tex}`, () =>
    katex.renderToString(tex, { displayMode: display, throwOnError: false, output: "htmlAndMathml" }),
  );
}
