import { describe, expect, it } from "vitest";
import { formatRational } from "../../../../domain/algebra/rational";
import { exactDecimal, readMathPolynomial, readNumber, MathError } from "../../../../domain/network/sbml/mathml";
import { readXml, type XmlElement } from "../../../../domain/network/sbml/xml-tree";

const el = (xml: string): XmlElement => {
  const r = readXml(xml);
  if (!r.ok) throw new Error(r.message);
  return r.root;
};
const poly = (xml: string) =>
  readMathPolynomial(el(`<math>${xml}</math>`)).map((m) => `${formatRational(m.coefficient)}*${[...m.powers].map(([s, p]) => `${s}^${p}`).sort().join("*")}`).sort();

describe("MathML numbers, read exactly", () => {
  it("reads integer, real, e-notation and rational <cn>", () => {
    expect(formatRational(readNumber(el('<cn type="integer"> 42 </cn>')))).toBe("42");
    expect(formatRational(readNumber(el("<cn>0.125</cn>")))).toBe("1/8");
    expect(formatRational(readNumber(el("<cn>2e-3</cn>")))).toBe("1/500");
    expect(formatRational(readNumber(el('<cn type="e-notation">15<sep/>-1</cn>')))).toBe("3/2");
    expect(formatRational(readNumber(el('<cn type="rational">2<sep/>6</cn>')))).toBe("1/3");
    expect(() => readNumber(el("<cn>NaN</cn>"))).toThrow(MathError);
    expect(() => readNumber(el('<cn type="integer">1.5</cn>'))).toThrow(MathError);
  });

  it("writes exact decimals only when they exist", () => {
    expect(exactDecimal({ num: 3n, den: 8n })).toBe("0.375");
    expect(exactDecimal({ num: -7n, den: 20n })).toBe("-0.35");
    expect(exactDecimal({ num: 5n, den: 1n })).toBe("5");
    expect(exactDecimal({ num: 1n, den: 3n })).toBeNull();
  });
});

describe("MathML rate laws as exact polynomials", () => {
  it("expands products, differences, quotients by a term and integer powers", () => {
    expect(poly("<apply><times/><ci>V</ci><apply><minus/><apply><times/><ci>kf</ci><ci>A</ci></apply><apply><times/><ci>kr</ci><ci>B</ci></apply></apply></apply>")).toEqual([
      "-1*B^1*V^1*kr^1",
      "1*A^1*V^1*kf^1",
    ]);
    expect(poly("<apply><divide/><apply><times/><ci>k</ci><apply><power/><ci>A</ci><cn>3</cn></apply></apply><cn>2</cn></apply>")).toEqual(["1/2*A^3*k^1"]);
    expect(poly("<apply><minus/><apply><times/><ci>k</ci><ci>A</ci></apply><apply><times/><ci>A</ci><ci>k</ci></apply></apply>")).toEqual([]);
    expect(poly("<semantics><apply><times/><ci>k</ci><ci>A</ci></apply><annotation>x</annotation></semantics>")).toEqual(["1*A^1*k^1"]);
  });

  it("refuses what is not a polynomial, saying what it found", () => {
    expect(() => poly("<apply><divide/><ci>A</ci><apply><plus/><ci>K</ci><ci>A</ci></apply></apply>")).toThrow(/divides by a sum/);
    expect(() => poly("<apply><exp/><ci>A</ci></apply>")).toThrow(/uses <exp\/>/);
    expect(() => poly("<apply><power/><ci>A</ci><cn>0.5</cn></apply>")).toThrow(/not a whole number/);
    expect(() => poly("<apply><ci>f</ci><ci>A</ci></apply>")).toThrow(/calls the function `f`/);
    expect(() => poly('<csymbol definitionURL="http://www.sbml.org/sbml/symbols/time">t</csymbol>')).toThrow(/uses the symbol `t`/);
    expect(() => poly("<piecewise/>")).toThrow(/uses <piecewise>/);
  });
});
