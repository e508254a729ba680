import { describe, expect, it } from "vitest";
import { notFound } from "~/shared/responses";

describe("notFound", () => {
  it("is a 404 with the given text, or a plain default", async () => {
    const r = notFound("No version 9");
    expect([r.status, r.statusText, await r.text()]).toEqual([404, "Not Found", "No version 9"]);
    expect(await notFound().text()).toBe("Not found");
  });
});
