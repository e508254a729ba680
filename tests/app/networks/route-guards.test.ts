import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

/**
 * Every loader and action of the network routes asks the permission module first: the first
 * statement of each is a `require…Role(request, …)` call (see app/permissions/permissions.server.ts).
 */
const files = [
  ...readdirSync("app/routes").filter((f) => f.startsWith("networks")).map((f) => `app/routes/${f}`),
  ...readdirSync("app/routes/api").filter((f) => f.startsWith("networks")).map((f) => `app/routes/api/${f}`),
];

describe("network routes check permissions first", () => {
  it("covers the pages, downloads and API routes", () => {
    expect(files.length).toBeGreaterThanOrEqual(11);
  });
  for (const file of files) {
    it(file, () => {
      const source = readFileSync(file, "utf8");
      const handlers = [...source.matchAll(/export async function (loader|action)\([^)]*\)[^{]*\{\n\s*([^\n]+)/g)];
      expect(handlers.length, "has a loader or an action").toBeGreaterThan(0);
      for (const [, name, firstLine] of handlers) {
        expect(firstLine, `${name} of ${file}`).toMatch(/^const \w+ = await require(Api)?(Active)?LabRole\(request, /);
      }
    });
  }
});
