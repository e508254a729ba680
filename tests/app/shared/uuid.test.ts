import { describe, expect, it } from "vitest";
import { isUuid } from "~/shared/uuid";

describe("isUuid", () => {
  it("accepts the text form of a UUID in either case", () => {
    expect(isUuid("0b5c7e3a-9d41-4f6e-8a2b-1c3d5e7f9a0b")).toBe(true);
    expect(isUuid("0B5C7E3A-9D41-4F6E-8A2B-1C3D5E7F9A0B")).toBe(true);
  });
  it("refuses anything else, including 36 characters of dashes and hex", () => {
    for (const bad of [undefined, null, "", "42", "0b5c7e3a9d414f6e8a2b1c3d5e7f9a0b", "------------------------------------", "0b5c7e3a-9d41-4f6e-8a2b-1c3d5e7f9a0g"]) {
      expect(isUuid(bad)).toBe(false);
    }
  });
});
