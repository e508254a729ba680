import { describe, expect, it } from "vitest";
import { requireBody, schemaProblems } from "~/api/body";
import { ANALYSIS_CREATE, LAB_CREATE, NETWORK_CREATE, SCAN_CREATE } from "~/api/schemas";

describe("request bodies checked by their zod schemas", () => {
  it("accepts a valid network body and locates each wrong field by JSON Pointer", () => {
    expect(schemaProblems(NETWORK_CREATE, { name: "E", csv: "reaction\nA -> B\n", tags: ["a", "b"] })).toEqual([]);
    expect(schemaProblems(NETWORK_CREATE, { name: "E", tags: "a, b", sbml: "<sbml/>" })).toEqual([]);
    expect(schemaProblems(NETWORK_CREATE, { name: 5, csv: ["x"], tags: [1] })).toEqual([
      // In the schema's field order.
      { path: "/name", message: "expected a string, got an integer" },
      { path: "/tags", message: "matches none of the accepted forms (got an array)" },
      { path: "/csv", message: "expected a string, got an array" },
    ]);
    expect(schemaProblems(NETWORK_CREATE, [])).toEqual([{ path: "", message: "expected an object, got an array" }]);
  });

  it("knows required fields, enums, integers and bounds of the analysis and scan bodies", () => {
    expect(schemaProblems(ANALYSIS_CREATE, { networkId: "n", initial: { X: "1/3", Y: 2 }, rateValues: { k: "0.5" }, timeLimitSeconds: 30 })).toEqual([]);
    expect(schemaProblems(ANALYSIS_CREATE, { rateMode: "fast", timeLimitSeconds: 2.5, initial: { X: true } })).toEqual([
      { path: "/networkId", message: "is required" },
      { path: "/rateMode", message: "expected one of numeric, symbolic" },
      { path: "/initial", message: "matches none of the accepted forms (got an object)" },
      { path: "/timeLimitSeconds", message: "expected an integer, got a number" },
    ]);
    expect(schemaProblems(SCAN_CREATE, { parameterKind: "rate", parameter: "k1", from: "1", to: 2, points: 500 })).toEqual([
      { path: "/from", message: "expected a number, got a string" },
      { path: "/points", message: expect.stringMatching(/200/) },
    ]);
    expect(schemaProblems(LAB_CREATE, {})).toEqual([{ path: "/name", message: "is required" }]);
  });

  it("answers a mismatch with 400 invalid_request and the problems in details.schema", async () => {
    let thrown: unknown;
    try {
      requireBody(SCAN_CREATE, { parameter: "k1", from: 1, to: 2 });
    } catch (e) {
      thrown = e;
    }
    expect(thrown).toBeInstanceOf(Response);
    const res = thrown as Response;
    expect(res.status).toBe(400);
    const body = (await res.json()) as { error: { code: string; message: string; details: { schema: unknown } } };
    expect(body.error.code).toBe("invalid_request");
    expect(body.error.message).toBe("The JSON body does not match the schema: /parameterKind expected one of rate, initial.");
    expect(body.error.details.schema).toEqual([{ path: "/parameterKind", message: "expected one of rate, initial" }]);
  });
});
