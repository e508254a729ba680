import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { MemoryRouter, UNSAFE_ErrorResponseImpl } from "react-router";
import { describe, expect, it } from "vitest";
import { ErrorView } from "~/components/error-view";

// React Router's own class for a thrown `data(...)` / Response, as an ErrorBoundary receives it.
const routeError = (status: number, payload: unknown, statusText = "") =>
  new UNSAFE_ErrorResponseImpl(status, statusText, payload);

const render = (error: unknown) =>
  renderToString(createElement(MemoryRouter, null, createElement(ErrorView, { error })))
    .replace(/<!-- -->/g, "")
    .replace(/&#x27;/g, "'");

describe("ErrorView", () => {
  it("explains a 404 and offers a way back", () => {
    const html = render(routeError(404, null));
    expect(html).toContain("Error 404");
    expect(html).toContain("Page not found");
    expect(html).toContain('href="/"');
  });

  it("shows the message a route threw with a 403, or the API error shape's message", () => {
    expect(render(routeError(403, "Viewers cannot edit networks."))).toContain("Viewers cannot edit networks.");
    const api = render(routeError(403, { error: { code: "forbidden", message: "Only owners manage members." } }));
    expect(api).toContain("Not allowed");
    expect(api).toContain("Only owners manage members.");
  });

  it("uses the status text for other handled statuses", () => {
    const html = render(routeError(409, "This version already exists.", "Conflict"));
    expect(html).toContain("Error 409");
    expect(html).toContain("Conflict");
    expect(html).toContain("This version already exists.");
  });

  it("treats anything else as a 500, with details only in development", () => {
    const html = render(new Error("boom in loader"));
    expect(html).toContain("Error 500");
    expect(html).toContain("Something went wrong");
    // vitest runs with import.meta.env.DEV = true, so the message is shown.
    expect(html).toContain("boom in loader");
  });
});
