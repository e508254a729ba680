import { describe, expect, it } from "vitest";
import { ExpressionError, evaluateExpression } from "../../../bench/lib/expression";
import { q, type Q } from "../../../bench/lib/rational";

const at = (values: Record<string, number>): Map<string, Q> => new Map(Object.entries(values).map(([k, v]) => [k, q(BigInt(v))]));

describe("evaluateExpression", () => {
  it("evaluates products, quotients, powers and parentheses exactly", () => {
    // (1 + 2)*3*4*5/((2 + 3)*1): worked by hand, 180/5 = 36.
    expect(evaluateExpression("(k11 + k12)*S0*E*k1/((k2 + k3)*F)", at({ k11: 1, k12: 2, S0: 3, E: 4, k1: 5, k2: 2, k3: 3, F: 1 }))).toEqual(q(36n));
    expect(evaluateExpression("S0*E^2/(k2 + k3)", at({ S0: 1, E: 3, k2: 2, k3: 5 }))).toEqual(q(9n, 7n));
    expect(evaluateExpression("-x + 2*-y - 1/2", at({ x: 1, y: 1 }))).toEqual(q(-7n, 2n));
    expect(evaluateExpression("2^10", new Map())).toEqual(q(1024n));
  });
  it("reports unknown names and malformed text", () => {
    expect(() => evaluateExpression("a*b", at({ a: 1 }))).toThrow(ExpressionError);
    expect(() => evaluateExpression("(a", at({ a: 1 }))).toThrow(/expected '\)'/);
    expect(() => evaluateExpression("a b", at({ a: 1, b: 1 }))).toThrow(/unexpected 'b'/);
    expect(() => evaluateExpression("a^b", at({ a: 1, b: 1 }))).toThrow(/integer exponent/);
  });
});
