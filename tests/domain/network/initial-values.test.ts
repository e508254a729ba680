import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { formatNetworkCsv, formatProblem, initialMapOf, parseNetworkCsv, tryParseNetworkCsv } from "@domain/network/index";
import { analyseStructure } from "@domain/network/structure";

const problemsOf = (text: string) => {
  const r = tryParseNetworkCsv(text);
  if (r.ok) throw new Error("expected problems");
  return r.problems.map(formatProblem);
};

const ENZYME = "reaction,rate\nE + S <-> C,k1\nC -> E + P,k3\n";

describe("initial values stored with a version (`# initial:`)", () => {
  it("are read exactly, in declaration order, zero allowed", () => {
    const net = parseNetworkCsv(`${ENZYME}# initial: S = 10, E = 1/3, P = 0\n`);
    expect(net.initial).toEqual([
      { name: "S", value: { num: 10n, den: 1n }, line: 4 },
      { name: "E", value: { num: 1n, den: 3n }, line: 4 },
      { name: "P", value: { num: 0n, den: 1n }, line: 4 },
    ]);
    expect(initialMapOf(net).get("E")).toEqual({ num: 1n, den: 3n });
    // The network itself does not depend on them (the rows keep their lines when the directive comes last).
    expect(analyseStructure(net)).toEqual({ ...analyseStructure(parseNetworkCsv(ENZYME)), initial: [{ name: "S", value: "10" }, { name: "E", value: "1/3" }, { name: "P", value: "0" }] });
  });

  it("keep the file a plain CSV for papaparse's comments option, and are written back and read again unchanged", () => {
    const text = `${ENZYME}# initial: E = 2.5\n# constant: P = 1\n`;
    expect(Papa.parse<string[]>(text, { comments: "#", skipEmptyLines: true }).data[0]).toEqual(["reaction", "rate"]);
    const net = parseNetworkCsv(text);
    const out = formatNetworkCsv(net);
    expect(out.split("\n").slice(0, 2)).toEqual(["# constant: P = 1", "# initial: E = 5/2"]);
    expect(parseNetworkCsv(out).initial?.map((i) => [i.name, i.value])).toEqual([["E", { num: 5n, den: 2n }]]);
  });

  it("report bad entries with line, column and what was expected", () => {
    expect(problemsOf(`# initial: E = -1\n${ENZYME}`)).toEqual([expect.stringMatching(/^line 1, column 12 \(initial\): the initial value `-1` of `E` is negative; expected a decimal ≥ 0/)]);
    expect(problemsOf(`# initial: E = two\n${ENZYME}`)[0]).toMatch(/^line 1, column 12 \(initial\): the initial value `two` of `E` is not a number/);
    expect(problemsOf(`# initial: E = 1e999999\n${ENZYME}`)[0]).toMatch(/`1e999999` of `E` is not a number/);
    expect(problemsOf(`# initial: E\n${ENZYME}`)[0]).toMatch(/^line 1, column 12 \(initial\): no initial value for `E`/);
    expect(problemsOf(`# initial: E = 1, Q = 2\n${ENZYME}`)).toEqual([
      "line 1, column 19 (initial): `Q` has an initial value but is not a species of any reaction; expected one of the species E, S, C, P",
    ]);
    expect(problemsOf(`${ENZYME}# initial: E = 1\n#initial: E = 2\n`)).toEqual([
      "line 5, column 11 (initial): `E` is given an initial value twice (first on line 4, column 12); expected one initial value per species",
    ]);
    expect(problemsOf(`# initial:\n${ENZYME}`)[0]).toMatch(/^line 1, column 11 \(initial\): the `# initial:` line names no species/);
    expect(problemsOf(`# initial: 2E = 1\n${ENZYME}`)[0]).toMatch(/`2E = 1` is not a species declaration/);
    expect(problemsOf(`# constant: P = 1\n# initial: P = 1\n${ENZYME}`)).toEqual([
      expect.stringMatching(/^line 2, column 12 \(initial\): `P` is held constant, so it has no initial value of its own/),
    ]);
  });
});
