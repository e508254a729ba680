import http from "node:http";
import type { AddressInfo } from "node:net";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { appListener, setClientAddress } from "../../scripts/serve";
import { BODY_LIMITS, bodyLimitFor } from "../../scripts/lib/request-guards";
import { MAX_CSV_BYTES } from "~/networks/grid";
import { hasTestDatabase, type TestDatabase } from "../app/support/test-db";
import { run, setUpAccountsDb, tearDownAccountsDb } from "../app/auth/fixtures";

/** A fake incoming request: only what setClientAddress reads. */
function fakeRequest(remoteAddress: string | undefined, rawHeaders: string[]) {
  const headers: Record<string, string> = {};
  for (let i = 0; i < rawHeaders.length; i += 2) headers[rawHeaders[i].toLowerCase()] = rawHeaders[i + 1];
  return { socket: { remoteAddress }, rawHeaders: [...rawHeaders], headers } as unknown as http.IncomingMessage;
}

describe("setClientAddress", () => {
  it("replaces any client-sent X-Forwarded-For with the socket address", () => {
    const req = fakeRequest("::ffff:127.0.0.2", ["Host", "x", "X-Forwarded-For", "10.0.0.1", "x-forwarded-for", "10.0.0.2"]);
    setClientAddress(req, false);
    expect(req.rawHeaders).toEqual(["Host", "x", "X-Forwarded-For", "127.0.0.2"]);
    expect(req.headers["x-forwarded-for"]).toBe("127.0.0.2");
  });

  it("keeps a trusted proxy's header, and fills it in when the proxy sent none", () => {
    const proxied = fakeRequest("127.0.0.1", ["X-Forwarded-For", "203.0.113.9, 198.51.100.7"]);
    setClientAddress(proxied, true);
    expect(proxied.rawHeaders).toEqual(["X-Forwarded-For", "203.0.113.9, 198.51.100.7"]);
    const direct = fakeRequest("::1", ["Host", "x"]);
    setClientAddress(direct, true);
    expect(direct.rawHeaders).toEqual(["Host", "x", "X-Forwarded-For", "::1"]);
  });

  it("drops the header when the socket address is unknown", () => {
    const req = fakeRequest(undefined, ["X-Forwarded-For", "10.0.0.1"]);
    setClientAddress(req, false);
    expect(req.rawHeaders).toEqual([]);
    expect(req.headers["x-forwarded-for"]).toBeUndefined();
  });
});

/** Starts `listener` on 127.0.0.1 and sends requests from a chosen loopback source address. */
async function listen(listener: http.RequestListener) {
  const server = http.createServer(listener);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const port = (server.address() as AddressInfo).port;
  const send = (
    target: string,
    opts: { method?: string; from?: string; headers?: Record<string, string>; body?: string } = {},
  ) =>
    new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string }>((resolve, reject) => {
      const req = http.request(
        { host: "127.0.0.1", port, path: target, method: opts.method ?? "GET", localAddress: opts.from, headers: opts.headers },
        (res) => {
          let body = "";
          res.setEncoding("utf8");
          res.on("data", (c: string) => (body += c));
          res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body }));
        },
      );
      req.on("error", reject);
      req.end(opts.body);
    });
  return { send, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
}

describe("static files", () => {
  const dir = mkdtempSync(path.join(os.tmpdir(), "stillpoint-serve-"));
  let server: Awaited<ReturnType<typeof listen>>;
  beforeAll(async () => {
    mkdirSync(path.join(dir, "client", "assets"), { recursive: true });
    writeFileSync(path.join(dir, "client", "assets", "root-Ab12.js"), "export {};");
    writeFileSync(path.join(dir, "client", "favicon.svg"), "<svg/>");
    writeFileSync(path.join(dir, "secret.txt"), "outside");
    server = await listen(
      appListener({
        clientDir: path.join(dir, "client"),
        handle: (req, res) => res.writeHead(200, { "Content-Type": "text/plain" }).end(`app ${req.method} ${req.url}`),
      }),
    );
  });
  afterAll(async () => {
    await server.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it("serves hashed assets with a long immutable cache and other files revalidated", async () => {
    const asset = await server.send("/assets/root-Ab12.js");
    expect(asset.status).toBe(200);
    expect(asset.body).toBe("export {};");
    expect(asset.headers["content-type"]).toMatch(/^text\/javascript/);
    expect(asset.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
    const icon = await server.send("/favicon.svg");
    expect(icon.headers["content-type"]).toBe("image/svg+xml");
    expect(icon.headers["cache-control"]).toBe("public, max-age=0");
  });

  it("hands everything else to the app, including paths that try to leave the folder", async () => {
    expect((await server.send("/labs")).body).toBe("app GET /labs");
    expect((await server.send("/assets/missing.js")).body).toBe("app GET /assets/missing.js");
    expect((await server.send("/%2e%2e/secret.txt")).body).toBe("app GET /%2e%2e/secret.txt");
    expect((await server.send("/favicon.svg", { method: "POST" })).body).toBe("app POST /favicon.svg");
  });
});

describe("request guards: body limits, NUL characters, security headers", () => {
  let server: Awaited<ReturnType<typeof listen>>;
  let reached = 0;
  beforeAll(async () => {
    server = await listen(
      appListener({
        clientDir: path.join(os.tmpdir(), "stillpoint-no-client"),
        handle: (req, res) => {
          reached++;
          let size = 0;
          req.on("data", (c: Buffer) => (size += c.length));
          req.on("end", () => res.writeHead(200, { "Content-Type": "text/plain" }).end(`app ${req.method} ${req.url} ${size}`));
        },
      }),
    );
  });
  afterAll(async () => server.close());

  it("refuses a declared body over the route's limit without reading it (anonymous sign-in included)", async () => {
    const before = reached;
    const out = await server.send("/sign-in", { method: "POST", headers: { "Content-Length": String(100 * 1024 * 1024), "Content-Type": "application/x-www-form-urlencoded" }, body: "email=a" }).catch((e) => ({ status: -1, headers: {}, body: String(e) }));
    expect(out.status).toBe(413);
    expect(JSON.parse(out.body).error.code).toBe("payload_too_large");
    expect(reached).toBe(before);
  });

  it("cuts off a chunked body at the limit, and lets an upload-sized body through on upload routes only", async () => {
    const big = "x".repeat(300 * 1024);
    const chunked = { "Transfer-Encoding": "chunked", "Content-Type": "text/csv" };
    const before = reached;
    const signIn = await server.send("/sign-in", { method: "POST", headers: chunked, body: big });
    expect(signIn.status).toBe(413);
    const other = await server.send("/labs/alpha", { method: "POST", headers: chunked, body: big });
    expect(other.status).toBe(413);
    expect(reached).toBe(before);
    const upload = await server.send("/api/labs/alpha/networks", { method: "POST", headers: chunked, body: big });
    expect(upload.status).toBe(200);
    expect(upload.body).toBe(`app POST /api/labs/alpha/networks ${big.length}`);
    const form = await server.send("/labs/alpha/networks/new.data", { method: "POST", headers: chunked, body: big });
    expect(form.status).toBe(200);
    expect(bodyLimitFor("/sign-in")).toBe(BODY_LIMITS.anonymous);
    expect(BODY_LIMITS.upload).toBeGreaterThanOrEqual(2 * MAX_CSV_BYTES);
  });

  it("refuses NUL characters in form fields, JSON and multipart parts, naming where", async () => {
    const form = await server.send("/labs/alpha", { method: "POST", headers: { "Content-Type": "application/x-www-form-urlencoded" }, body: "intent=rename&name=Lab%00X" });
    expect(form.status).toBe(400);
    expect(JSON.parse(form.body).error).toMatchObject({ code: "invalid_request", details: { where: "field `name`" } });
    const json = await server.send("/api/labs", { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify({ lab: { name: "a\u0000b" } }) });
    expect(json.status).toBe(400);
    expect(JSON.parse(json.body).error.details.where).toBe("JSON at `lab.name`");
    const multipart = await server.send("/api/labs/alpha/networks", {
      method: "POST",
      headers: { "Content-Type": "multipart/form-data; boundary=XX" },
      body: '--XX\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\nreaction\nA\u0000 -> B\r\n--XX--\r\n',
    });
    expect(multipart.status).toBe(400);
    expect(JSON.parse(multipart.body).error.details.where).toBe("part `file`");
    // A NUL inside an uploaded file means a binary file: said in one line, located in the file.
    expect(JSON.parse(multipart.body).error.message).toBe("a.csv: this is not a text file: binary content at byte 11 (0x00, line 2); nothing was saved.");
    expect(JSON.parse(multipart.body).error.details.problems).toEqual([expect.objectContaining({ row: 2 })]);
    expect((await server.send("/labs/alpha", { method: "POST", headers: { "Content-Type": "application/x-www-form-urlencoded" }, body: "name=fine" })).status).toBe(200);
  });

  it("keeps every Set-Cookie line the app writes (the sign-in sets several) alongside the security headers", async () => {
    const cookies = await listen(
      appListener({
        clientDir: path.join(os.tmpdir(), "stillpoint-no-client"),
        // As @react-router/node writes a response: one raw array, Set-Cookie repeated.
        handle: (_req, res) => res.writeHead(302, ["Location", "/next", "Set-Cookie", "a=1", "Set-Cookie", "b=2", "Set-Cookie", "c=3"]).end(),
      }),
    );
    try {
      const out = await cookies.send("/sign-in", { method: "POST", headers: { "Content-Type": "application/x-www-form-urlencoded" }, body: "email=a" });
      expect(out.headers["set-cookie"]).toEqual(["a=1", "b=2", "c=3"]);
      expect(out.headers["x-frame-options"]).toBe("DENY");
    } finally {
      await cookies.close();
    }
  });

  it("sends the security headers on pages and on refusals", async () => {
    for (const out of [await server.send("/labs"), await server.send("/sign-in", { method: "POST", headers: { "Content-Length": "99999999" }, body: "" }).catch(() => undefined)]) {
      if (!out) continue;
      expect(out.headers["content-security-policy"]).toMatch(/default-src 'self'/);
      expect(out.headers["content-security-policy"]).toMatch(/frame-ancestors 'none'/);
      expect(out.headers["x-frame-options"]).toBe("DENY");
      expect(out.headers["x-content-type-options"]).toBe("nosniff");
      expect(out.headers["referrer-policy"]).toBe("strict-origin-when-cross-origin");
    }
  });
});

/** The app side of the listener for this test: the real sign-in action behind a Fetch Request. */
function signInHandler(action: Parameters<typeof run>[0]): http.RequestListener {
  return (req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", async () => {
      // Headers from rawHeaders, as @react-router/node builds them.
      const headers = new Headers();
      for (let i = 0; i < req.rawHeaders.length; i += 2) headers.append(req.rawHeaders[i], req.rawHeaders[i + 1]);
      const request = new Request(`http://127.0.0.1${req.url}`, { method: req.method, headers, body: Buffer.concat(chunks) });
      const out = await run(action, request);
      res.writeHead(out.status).end();
    });
  };
}

describe.skipIf(!hasTestDatabase)("per-client sign-in allowance over real connections", () => {
  let t: TestDatabase;
  let server: Awaited<ReturnType<typeof listen>>;
  let restoreMail: () => void;
  let maxPerClient: number;

  beforeAll(async () => {
    t = await setUpAccountsDb();
    restoreMail = (await import("~/mail/mailer.server")).captureMail().restore;
    maxPerClient = (await import("~/auth/login-codes.server")).SIGN_IN_POLICY.maxRequestsPerClient;
    const signIn = await import("~/routes/sign-in");
    server = await listen(appListener({ clientDir: path.join(os.tmpdir(), "stillpoint-no-client"), handle: signInHandler(signIn.action) }));
  });
  afterAll(async () => {
    await server?.close();
    restoreMail?.();
    await tearDownAccountsDb(t);
  });

  const ask = (email: string, from: string, headers: Record<string, string> = {}) =>
    server.send("/sign-in", {
      method: "POST",
      from,
      headers: { "Content-Type": "application/x-www-form-urlencoded", ...headers },
      body: new URLSearchParams({ email, returnTo: "/labs" }).toString(),
    });

  it("gives 127.0.0.1 and 127.0.0.2 separate allowances, and a forged header changes nothing", async () => {
    for (let i = 0; i < maxPerClient; i++) expect((await ask(`person${i}@lab.test`, "127.0.0.2")).status).toBe(302);
    expect((await ask("one-more@lab.test", "127.0.0.2")).status).toBe(429);
    expect((await ask("one-more@lab.test", "127.0.0.2", { "X-Forwarded-For": "198.51.100.7" })).status).toBe(429);
    // The other loopback client still has its whole allowance.
    expect((await ask("one-more@lab.test", "127.0.0.1")).status).toBe(302);
    const rows = await t.db.selectFrom("login_codes").select("client_key").execute();
    expect(new Set(rows.map((r) => r.client_key))).toEqual(new Set(["ip:127.0.0.2", "ip:127.0.0.1"]));
  });
});
