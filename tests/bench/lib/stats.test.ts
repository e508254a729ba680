import { describe, expect, it } from "vitest";
import { median } from "../../../bench/lib/stats";

describe("median", () => {
  it("takes the middle value of an odd count, whatever the input order", () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([0.5])).toBe(0.5);
  });
  it("takes the mean of the middle two for an even count (Hyndman and Fan 1996, type 7 at p = 1/2)", () => {
    expect(median([4, 1, 3, 2])).toBe(2.5);
  });
  it("does not reorder its argument and refuses an empty list", () => {
    const xs = [3, 1, 2];
    median(xs);
    expect(xs).toEqual([3, 1, 2]);
    expect(() => median([])).toThrow(RangeError);
  });
});
