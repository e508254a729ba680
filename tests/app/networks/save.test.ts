import { describe, expect, it } from "vitest";
import { checkCsv, parseChangeNote, parseDetails, parseTags } from "~/networks/save.server";

describe("network input checks", () => {
  it("normalises tags and refuses odd ones", () => {
    expect(parseTags(" Enzyme, teaching ,enzyme,, ")).toEqual({ ok: true, tags: ["enzyme", "teaching"] });
    expect(parseTags(["a-b", "c.d"])).toEqual({ ok: true, tags: ["a-b", "c.d"] });
    expect(parseTags("ok, <script>").ok).toBe(false);
    expect(parseTags(Array.from({ length: 13 }, (_, i) => `t${i}`)).ok).toBe(false);
    expect(parseTags(42).ok).toBe(false);
  });

  it("needs a name and keeps field messages", () => {
    const r = parseDetails({ name: "  ", description: "x".repeat(5001), tags: "fine" });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.details!.fields!).sort()).toEqual(["description", "name"]);
    expect(parseDetails({ name: " Cycle ", tags: "a" })).toEqual({ ok: true, details: { name: "Cycle", description: "", tags: ["a"] } });
  });

  it("fills an empty change note and bounds its length", () => {
    expect(parseChangeNote("", "First version.")).toEqual({ ok: true, note: "First version." });
    expect(parseChangeNote("x".repeat(501), "-").ok).toBe(false);
  });

  it("accepts only CSV that parses without a problem, within the size limit", () => {
    expect(checkCsv("reaction\nA -> B\n").ok).toBe(true);
    const bad = checkCsv("reaction\nA -> A\n");
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.details!.problems![0]).toMatchObject({ row: 2, column: "reaction" });
    expect(checkCsv("").ok).toBe(false);
    expect(checkCsv(undefined).ok).toBe(false);
    const huge = checkCsv("reaction\n" + "A -> B\n".repeat(40_000));
    expect(huge.ok).toBe(false);
    if (!huge.ok) expect(huge.message).toMatch(/256 KB/);
  });

  it("refuses a network larger than the stated limits before computing its structure", async () => {
    const { NETWORK_LIMITS } = await import("@domain/network/index");
    const n = NETWORK_LIMITS.maxSpecies + 1;
    const csv = ["reaction,rate", ...Array.from({ length: n - 1 }, (_, i) => `S${i} -> S${i + 1},k${i}`)].join("\n") + "\n";
    const r = checkCsv(csv);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.details!.problems![0]).toMatchObject({ row: 1, message: `the network has ${n} species` });
  });

  it("refuses NUL characters in names, notes and the file with a located message (PostgreSQL cannot store them)", () => {
    const name = parseDetails({ name: "Cy\u0000cle" });
    expect(name.ok).toBe(false);
    if (!name.ok) expect(name.details!.fields!.name).toMatch(/control character/);
    const description = parseDetails({ name: "Cycle", description: "a\u0000b" });
    expect(description.ok).toBe(false);
    if (!description.ok) expect(Object.keys(description.details!.fields!)).toEqual(["description"]);
    expect(parseChangeNote("fix\u0000", "-").ok).toBe(false);
    const csv = checkCsv("reaction,label,rate\nA -> B,x\u0000y,k1\n");
    expect(csv.ok).toBe(false);
    if (!csv.ok) expect(csv.details!.problems![0]).toMatchObject({ row: 2, columnIndex: 2, message: "a NUL character" });
  });
});
