import { describe, expect, it } from "vitest";
import { navActive } from "~/components/app-shell";

// Which top-menu item is highlighted for pages nested under /labs/:slug/… (our own navigation rule).
describe("navActive", () => {
  const active = (pathname: string) =>
    ["/networks", "/analyses", "/labs"].filter((to) => navActive(to, pathname.startsWith(to), pathname));

  it("puts lab network pages under Networks", () => {
    expect(active("/labs/halvorsen/networks")).toEqual(["/networks"]);
    expect(active("/labs/halvorsen/networks/abc/versions")).toEqual(["/networks"]);
  });

  it("puts analysis pages and the start-analysis form under Analyses", () => {
    expect(active("/labs/halvorsen/analyses")).toEqual(["/analyses"]);
    expect(active("/labs/halvorsen/analyses/123")).toEqual(["/analyses"]);
    expect(active("/labs/halvorsen/networks/abc/analyse")).toEqual(["/analyses"]);
  });

  it("keeps lab management under Labs", () => {
    expect(active("/labs/halvorsen/members")).toEqual(["/labs"]);
    expect(active("/labs")).toEqual(["/labs"]);
  });
});
