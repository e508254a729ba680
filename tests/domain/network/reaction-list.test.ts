import { describe, expect, it } from "vitest";
import { formatNetworkCsv, formatReactionList, parseNetworkCsv, parseReactionList } from "../../../domain/network/index";
import { roundTripCorpus } from "./sbml/demo-corpus";
import { networkSignature } from "./sbml/network-signature";

describe("parseReactionList", () => {
  it("reads labels, rate names and values, comments and blank lines", () => {
    const r = parseReactionList("# enzyme\nbinding: E + S <-> C, kon = 2, koff = 1/10\n\nC -> E + P, kcat = 3  # turnover\n0 -> S, 1/2\nP -> 0\n");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(formatNetworkCsv(r.network)).toBe(
      "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,binding,kon,koff,2,1/10\nC -> E + P,,kcat,,3,\n0 -> S,,k4,,1/2,\nP -> 0,,k5,,,\n",
    );
  });

  it("locates problems at the text's line and the part of the line", () => {
    const r = parseReactionList("A -> B, k1 = 2\n\nA => B\nB -> C, k1 = 3\nC -> D, 1x\n");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const where = r.problems.map((p) => [p.row, p.column]);
    expect(where).toContainEqual([3, "reaction"]);
    expect(where).toContainEqual([4, "rate_value"]);
    expect(where).toContainEqual([5, "rate"]);
    expect(r.problems.find((p) => p.row === 4)!.message).toMatch(/value 3 here but 2 on line 2/);
  });

  it("refuses an irreversible reaction with a reverse rate, as the CSV does", () => {
    const r = parseReactionList("A -> B, k1, k2\n");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toMatchObject({ row: 1, column: "reverse_rate" });
  });

  it("says so when the list is empty", () => {
    const r = parseReactionList("# nothing\n\n");
    expect(r.ok).toBe(false);
  });

  it.each(roundTripCorpus())("formatReactionList reads back to the same network: $name", ({ csv }) => {
    const net = parseNetworkCsv(csv);
    const back = parseReactionList(formatReactionList(net));
    expect(back.ok).toBe(true);
    if (!back.ok) return;
    expect(networkSignature(back.network)).toEqual(networkSignature(net));
    expect(back.network.rows.map((r) => r.label)).toEqual(net.rows.map((r) => r.label));
  });

  it("carries held species and initial values as the CSV's directive lines, problems located in the text", () => {
    const net = parseNetworkCsv("reaction,rate,reverse_rate,rate_value\nA + 2X <-> 3X,k1,k2,3/2\nX <-> B,k3,k4,\n# constant: A = 2, B\n# initial: X = 1/2\n");
    const text = formatReactionList(net);
    // Terms of held species come after the others, as in the CSV writer.
    expect(text).toBe("# constant: A = 2, B\n# initial: X = 1/2\n2X + A <-> 3X, k1 = 3/2, k2\nX <-> B, k3, k4\n");
    const back = parseReactionList(text);
    expect(back.ok && networkSignature(back.network)).toEqual(networkSignature(net));
    const bad = parseReactionList("A + X -> 2X\n\n# initial: X = -1, Q = 1\n#constant: A = 0\n");
    expect(bad.ok).toBe(false);
    if (bad.ok) return;
    expect(bad.problems.map((p) => [p.row, p.columnIndex, p.column, p.message])).toEqual([
      [3, 12, "initial", "the initial value `-1` of `X` is negative"],
      [3, 20, "initial", "`Q` has an initial value but is not a species of any reaction"],
      [4, 12, "constant", "the concentration `0` of `A` is not a positive number"],
    ]);
  });

  it("quotes labels that contain the separators", () => {
    const net = parseNetworkCsv('reaction,label\nA -> B,"slow: step, #1 ""a"""\n');
    const text = formatReactionList(net);
    expect(text).toBe('"slow: step, #1 ""a""": A -> B, k1\n');
    const back = parseReactionList(text);
    expect(back.ok && back.network.rows[0].label).toBe('slow: step, #1 "a"');
  });
});
