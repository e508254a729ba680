import { describe, expect, it } from "vitest";
import { csvCell, csvTextSafe, latexText, texCommentText } from "~/downloads/escape";
import { stoichiometricMatrixCsv } from "~/networks/matrix-csv";
import { odesLatexDocument } from "~/networks/odes";

describe("escaping for exports", () => {
  it("keeps TeX comment text on one line", () => {
    for (const brk of ["\n", "\r", "\r\n", "\u2028", "\u2029", "\u0085", "\f", "\v"]) {
      expect(texCommentText(`a${brk}\\input{x}`)).toBe("a \\input{x}");
    }
    expect(texCommentText("a^^Jb")).toBe("a^ ^Jb");
  });

  it("escapes LaTeX specials and folds line breaks in headings", () => {
    expect(latexText("50% & $5 #1 a_b ~ ^ {x} \\")).toBe("50\\% \\& \\$5 \\#1 a\\_b \\textasciitilde{} \\textasciicircum{} \\{x\\} \\textbackslash{}");
    expect(latexText("Name\n\n\\par")).toBe("Name \\textbackslash{}par");
    const doc = odesLatexDocument("Evil\n\n}\\input{x}", []);
    expect(doc).toContain("\\section*{Evil \\}\\textbackslash{}input\\{x\\}}");
  });

  it("neutralises spreadsheet formulas but not numbers", () => {
    for (const f of ["=1+1", "+cmd", "-cmd", "@SUM(A1)", "\tx", "\rx", "-1+cmd|' /C calc'!A0"]) expect(csvCell(f)).toBe(`'${f}`);
    for (const n of ["-1", "+2.5", "-3e-5", "0", ".5", "text", "a=b"]) expect(csvCell(n)).toBe(n);
    expect(csvCell(-1)).toBe(-1);
  });

  it("leaves a clean CSV byte for byte, and escapes a hostile one cell by cell", () => {
    const clean = "reaction,label,rate\nA -> B,\"quoted, comma\",k1\n";
    expect(csvTextSafe(clean)).toBe(clean);
    expect(csvTextSafe("reaction,label,rate\nA -> B,=HYPERLINK(\"http://x\"),k1\n")).toBe("reaction,label,rate\nA -> B,\"'=HYPERLINK(\"\"http://x\"\")\",k1\n");
  });

  it("escapes species names in the stoichiometric matrix", () => {
    const csv = stoichiometricMatrixCsv({ species: ["@A", "B"], reactionList: [{ id: "r1" }] as never, stoichiometricMatrix: [[-1], [1]] });
    expect(csv).toBe("species,r1\n'@A,-1\nB,1\n");
  });
});
