import { describe, expect, it } from "vitest";
import { allowConsoleError } from "./console-errors";

describe("console.error in a test", () => {
  // `it.fails` passes only when the test fails: here, through the setup file's afterEach.
  it.fails("fails the test when nobody allowed it", () => {
    console.error("[check] an error nobody expected");
  });

  it("passes when the test allowed that message", () => {
    allowConsoleError(/^\[check\] expected/);
    console.error("[check] expected: the database is down");
    expect(true).toBe(true);
  });

  it.fails("still fails for a message the allowance does not match", () => {
    allowConsoleError(/^\[check\] expected/);
    console.error("[check] something else");
  });
});
