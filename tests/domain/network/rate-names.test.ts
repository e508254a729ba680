import { describe, expect, it } from "vitest";
import { defaultRateName } from "../../../domain/network";

describe("defaultRateName", () => {
  it("is k<i>, with a numbered suffix when taken", () => {
    expect(defaultRateName(3, new Set())).toBe("k3");
    expect(defaultRateName(3, new Set(["k3"]))).toBe("k3_2");
    expect(defaultRateName(3, new Set(["k3", "k3_2"]))).toBe("k3_3");
  });
});
