import { describe, expect, it } from "vitest";
import { clientKey } from "~/auth/client-key.server";

describe("clientKey", () => {
  it("uses the address the server put in the load context", () => {
    expect(clientKey({ clientAddress: "127.0.0.2" })).toBe("ip:127.0.0.2");
    expect(clientKey({ clientAddress: "::1" })).toBe("ip:::1");
  });

  it("ignores a client-sent X-Forwarded-For: the header is not read here at all", () => {
    // The proxy hop count is applied by the server (TRUST_PROXY); see tests/scripts/serve.test.ts.
    expect(clientKey({})).toBe("direct");
  });

  it("falls back to one shared bucket without an address", () => {
    expect(clientKey(undefined)).toBe("direct");
    expect(clientKey({ clientAddress: " " })).toBe("direct");
  });

  it("bounds the key length", () => {
    expect(clientKey({ clientAddress: "x".repeat(500) })).toBe(`ip:${"x".repeat(64)}`);
  });
});
