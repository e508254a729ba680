/**
 * A console.error during a test fails that test (vitest setup file, see vitest.config.ts): an
 * error log nobody asserted is a failure nobody noticed. A test that expects one says so with
 * `allowConsoleError(/pattern/)`, which admits only matching messages for the rest of that test.
 * The message still reaches the output, so a failing run shows what was logged.
 */
import { afterEach, beforeEach, vi } from "vitest";
import { format } from "node:util";

let allowed: RegExp[] = [];
let logged: string[] = [];
let spy: { mockRestore(): void } | undefined;

/** Lets console.error messages matching `pattern` pass in the current test (and only there). */
export function allowConsoleError(pattern: RegExp): void {
  allowed.push(pattern);
}

beforeEach(() => {
  allowed = [];
  logged = [];
  const original = console.error.bind(console);
  spy = vi.spyOn(console, "error").mockImplementation((...args: unknown[]) => {
    logged.push(format(...args));
    original(...args);
  });
});

afterEach(() => {
  spy?.mockRestore();
  spy = undefined;
  const unexpected = logged.filter((m) => !allowed.some((p) => p.test(m)));
  if (unexpected.length > 0) {
    throw new Error(`console.error during the test (allow it with allowConsoleError if it is expected):\n${unexpected.map((m) => `  ${m}`).join("\n")}`);
  }
});
