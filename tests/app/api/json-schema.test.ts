import { describe, expect, it } from "vitest";
import { checkJson } from "~/api/json-schema";
import { NETWORK_CREATE } from "~/api/schemas";

describe("checkJson (the JSON Schema subset of our request schemas)", () => {
  it("accepts a valid network body and locates each wrong field by JSON Pointer", () => {
    expect(checkJson(NETWORK_CREATE, { name: "E", csv: "reaction\nA -> B\n", tags: ["a", "b"] })).toEqual([]);
    expect(checkJson(NETWORK_CREATE, { name: "E", tags: "a, b", sbml: "<sbml/>" })).toEqual([]);
    expect(checkJson(NETWORK_CREATE, { name: 5, csv: ["x"], tags: [1] })).toEqual([
      { path: "/name", message: "expected a string, got an integer" },
      { path: "/csv", message: "expected a string, got an array" },
      { path: "/tags", message: "matches none of: string, array" },
    ]);
    expect(checkJson(NETWORK_CREATE, [])).toEqual([{ path: "", message: "expected an object, got an array" }]);
  });

  it("knows required fields, enums, lengths and closed objects", () => {
    const s = { type: "object" as const, required: ["a"], additionalProperties: false, properties: { a: { type: "string" as const, enum: ["x"], maxLength: 1 } } };
    expect(checkJson(s, {})).toEqual([{ path: "/a", message: "is required" }]);
    expect(checkJson(s, { a: "yy", b: 1 })).toEqual([
      { path: "/a", message: "expected one of x" },
      { path: "/a", message: "longer than 1 characters" },
      { path: "/b", message: "is not a known field" },
    ]);
  });
});
