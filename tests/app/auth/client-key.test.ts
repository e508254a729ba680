import { describe, expect, it } from "vitest";
import { clientKey } from "~/auth/client-key.server";

const req = (...xff: string[]) => {
  const headers = new Headers();
  for (const value of xff) headers.append("X-Forwarded-For", value);
  return new Request("http://x/", { headers });
};

describe("clientKey", () => {
  it("uses the single address the server wrote", () => {
    expect(clientKey(req("127.0.0.2"))).toBe("ip:127.0.0.2");
    expect(clientKey(req("::1"))).toBe("ip:::1");
  });

  it("takes the last hop of a proxy chain (earlier hops are client-supplied)", () => {
    expect(clientKey(req("203.0.113.9, 198.51.100.7"))).toBe("ip:198.51.100.7");
    expect(clientKey(req("203.0.113.9", "198.51.100.7"))).toBe("ip:198.51.100.7");
    expect(clientKey(req("203.0.113.9 , 198.51.100.7 ,"))).toBe("ip:198.51.100.7");
  });

  it("falls back to one shared bucket without the header", () => {
    expect(clientKey(req())).toBe("direct");
    expect(clientKey(req(" , "))).toBe("direct");
  });

  it("bounds the key length", () => {
    expect(clientKey(req("x".repeat(500)))).toBe(`ip:${"x".repeat(64)}`);
  });
});
