import { describe, expect, it } from "vitest";
import { formatDateTime, formatDay } from "~/shared/dates";

describe("dates", () => {
  it("writes minutes in UTC and says so, from a Date or an ISO string", () => {
    expect(formatDateTime(new Date("2026-12-02T14:05:59.999Z"))).toBe("2026-12-02 14:05 UTC");
    expect(formatDateTime("2026-01-09T00:00:00.000Z")).toBe("2026-01-09 00:00 UTC");
    // An offset in the input is converted, not copied: 23:30 at -02:00 is the next day in UTC.
    expect(formatDateTime("2026-03-31T23:30:00-02:00")).toBe("2026-04-01 01:30 UTC");
  });
  it("writes the UTC day", () => {
    expect(formatDay(new Date("2026-12-31T23:59:00Z"))).toBe("2026-12-31");
  });
  it("shows a dash for no date", () => {
    expect(formatDateTime(null)).toBe("—");
    expect(formatDay(undefined)).toBe("—");
  });
  it("agrees with the ISO text at minute precision over a spread of instants", () => {
    for (let t = Date.UTC(1999, 11, 31, 23, 59); t < Date.UTC(2031, 0, 1); t += 86_400_000 * 37 + 3_601_000) {
      const iso = new Date(t).toISOString();
      expect(formatDateTime(new Date(t))).toBe(`${iso.slice(0, 10)} ${iso.slice(11, 16)} UTC`);
    }
  });
});
