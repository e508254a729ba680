import { describe, expect, it } from "vitest";
import { commands } from "@domain/cli/commands";

describe("the command registry", () => {
  it("loads every registered command lazily, each with a handler and a one-line summary starting with its name", async () => {
    expect(Object.keys(commands).sort()).toEqual(["analyse", "convert", "divide", "groebner", "multistationarity", "scan"]);
    for (const [name, load] of Object.entries(commands)) {
      const command = await load();
      expect(typeof command.run, name).toBe("function");
      expect(command.summary.startsWith(name), name).toBe(true);
      expect(command.summary.includes("\n"), name).toBe(false);
    }
  });
});
