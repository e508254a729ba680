import katex from "katex";
import { describe, expect, it } from "vitest";
import { katexHtml, LruMap } from "~/components/render-cache";

describe("LruMap", () => {
  it("keeps at most `limit` entries, dropping the least recently used", () => {
    const m = new LruMap<number>(2);
    m.set("a", 1);
    m.set("b", 2);
    expect(m.get("a")).toBe(1); // a is now the most recent
    m.set("c", 3);
    expect(m.get("b")).toBeUndefined();
    expect(m.get("a")).toBe(1);
    expect(m.get("c")).toBe(3);
    expect(m.size).toBe(2);
  });

  it("computes once per key", () => {
    const m = new LruMap<string>(10);
    let calls = 0;
    const f = () => `v${++calls}`;
    expect(m.getOrCompute("k", f)).toBe("v1");
    expect(m.getOrCompute("k", f)).toBe("v1");
    expect(calls).toBe(1);
  });
});

describe("katexHtml", () => {
  it("gives exactly KaTeX's own output, for display and inline formulas alike", () => {
    const tex = String.raw`\frac{d[A]}{dt} = -k_1 [A][B]`;
    expect(katexHtml(tex, true)).toBe(katex.renderToString(tex, { displayMode: true, throwOnError: false, output: "htmlAndMathml" }));
    expect(katexHtml(tex, false)).toBe(katex.renderToString(tex, { displayMode: false, throwOnError: false, output: "htmlAndMathml" }));
    expect(katexHtml(tex, true)).not.toBe(katexHtml(tex, false));
  });
});
