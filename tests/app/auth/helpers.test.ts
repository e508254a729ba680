import { describe, expect, it } from "vitest";
import { clientKey } from "~/auth/client-key.server";
import { hmacHex, randomToken, sameHex, sha256Hex } from "~/auth/hashing.server";
import { CODE_CHARSET, looksLikeEmail, normalizeCode, normalizeEmail } from "~/auth/login-codes.server";
import { safeReturnTo } from "~/auth/session.server";
import { readTotpCookie } from "~/auth/totp-cookie.server";
import { parseDisplayName } from "~/auth/users.server";

describe("sign-in helpers (no database)", () => {
  it("normalises typed codes and addresses", () => {
    expect(normalizeCode(" ab-c 12x ")).toBe("ABC12X");
    expect(normalizeCode(undefined)).toBe("");
    expect(normalizeEmail("  Ada@Example.ORG ")).toBe("ada@example.org");
    expect(looksLikeEmail("ada@example.org")).toBe(true);
    expect(["ada", "ada@", "@x.org", "a b@x.org", "ada@localhost"].some(looksLikeEmail)).toBe(false);
  });

  it("uses a code alphabet without look-alike characters", () => {
    expect(CODE_CHARSET).toHaveLength(32);
    expect(CODE_CHARSET).not.toMatch(/[01IO]/);
  });

  it("hashes: SHA-256 of a known input, keyed HMAC differs per key, tokens are long and random", () => {
    // SHA-256("abc") from FIPS 180-2, Appendix B.1.
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
    expect(hmacHex("k1", "ABC123")).not.toBe(hmacHex("k2", "ABC123"));
    expect(sameHex(sha256Hex("x"), sha256Hex("x"))).toBe(true);
    expect(sameHex(sha256Hex("x"), sha256Hex("y"))).toBe(false);
    expect(sameHex("", "")).toBe(false);
    const a = randomToken();
    expect(a).toMatch(/^[A-Za-z0-9_-]{43}$/);
    expect(randomToken()).not.toBe(a);
  });

  it("keeps returnTo on this site", () => {
    expect(safeReturnTo("/labs/x?y=1")).toBe("/labs/x?y=1");
    for (const bad of ["https://evil.example", "//evil.example", "/\\evil", "labs", null, 42]) expect(safeReturnTo(bad)).toBe("/labs");
  });

  it("refuses returnTo values a browser would turn into another host, and never yields a broken header", () => {
    // From the drill: `returnTo=/%09/evil.example/phish` (decoded: a tab), %0a, %0d, U+3000.
    const attacks = ["/\t/evil.example/phish", "/\n/evil.example", "/\r/evil.example", "/\u3000/evil.example", "/a\nb", "/a\rb",
      "/\u3000", "/.//evil.example", "/%2e//evil.example", "/x/..//evil.example", "/\u0000", "/\u00a0/evil.example", "/ /evil.example"];
    for (const raw of attacks) {
      const safe = safeReturnTo(raw);
      expect(() => new Headers({ Location: safe })).not.toThrow();
      // What a browser does with the Location: strip tab/newline, resolve against the page.
      const landed = new URL(safe.replace(/[\t\n\r]/g, ""), "https://app.example.org/sign-in");
      expect(landed.origin, JSON.stringify(raw)).toBe("https://app.example.org");
    }
    expect(safeReturnTo("/\t/evil.example/phish")).toBe("/labs");
    expect(safeReturnTo("/labs/a/../b?x=%20y#z")).toBe("/labs/b?x=%20y#z");
    expect(safeReturnTo("/labs/é")).toBe("/labs/%C3%A9");
  });

  it("reads the pending address and error from remix-auth-totp's cookie", () => {
    const value = new URLSearchParams({ email: "ada@example.org", totp: '{"jwe":"x","attempts":0}', error: "That code didn't work." }).toString();
    const req = new Request("http://x/", { headers: { Cookie: `other=1; _totp=${value}; more=2` } });
    expect(readTotpCookie(req)).toEqual({ email: "ada@example.org", error: "That code didn't work." });
    expect(readTotpCookie(new Request("http://x/"))).toEqual({});
  });

  it("takes the client from the server's load context, one shared bucket without it", () => {
    expect(clientKey({ clientAddress: "198.51.100.7" })).toBe("ip:198.51.100.7");
    expect(clientKey({})).toBe("direct");
  });

  it("validates display names", () => {
    expect(parseDisplayName("  Ada   Lovelace ")).toEqual({ ok: true, value: "Ada Lovelace" });
    expect(parseDisplayName("").ok).toBe(false);
    expect(parseDisplayName("x".repeat(101)).ok).toBe(false);
  });
});
