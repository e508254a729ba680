import http from "node:http";
import type { AddressInfo } from "node:net";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Application, RequestHandler } from "express";
import { createApp, clientAddressOf, parseTrustProxy } from "../../scripts/serve";
import { gunzipSync } from "node:zlib";
import { BODY_LIMITS, bodyLimitFor } from "../../scripts/lib/request-guards";
import { MAX_CSV_BYTES } from "~/networks/grid";
import { hasTestDatabase, type TestDatabase } from "../app/support/test-db";
import { run, setUpAccountsDb, tearDownAccountsDb } from "../app/auth/fixtures";

describe("parseTrustProxy", () => {
  it("reads TRUST_PROXY as express's trust proxy setting, refusing 'believe everyone'", () => {
    expect(parseTrustProxy(undefined)).toBe(false);
    expect(parseTrustProxy("")).toBe(false);
    expect(parseTrustProxy("0")).toBe(false);
    expect(parseTrustProxy("1")).toBe(1);
    expect(parseTrustProxy("loopback, 10.0.0.0/8")).toBe("loopback, 10.0.0.0/8");
    expect(() => parseTrustProxy("true")).toThrow(/choose its own address/);
  });
});

/** Starts `listener` on 127.0.0.1 and sends requests from a chosen loopback source address. */
async function listen(listener: http.RequestListener | Application) {
  const server = http.createServer(listener);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const port = (server.address() as AddressInfo).port;
  const send = (
    target: string,
    opts: { method?: string; from?: string; headers?: Record<string, string>; body?: string } = {},
  ) =>
    new Promise<{ status: number; headers: http.IncomingHttpHeaders; body: string; raw: Buffer }>((resolve, reject) => {
      const req = http.request(
        { host: "127.0.0.1", port, path: target, method: opts.method ?? "GET", localAddress: opts.from, headers: opts.headers },
        (res) => {
          const chunks: Buffer[] = [];
          res.on("data", (c: Buffer) => chunks.push(c));
          res.on("end", () => {
            const raw = Buffer.concat(chunks);
            resolve({ status: res.statusCode ?? 0, headers: res.headers, body: raw.toString("utf8"), raw });
          });
        },
      );
      req.on("error", reject);
      req.end(opts.body);
    });
  return { send, port, close: () => new Promise<void>((resolve) => server.close(() => resolve())) };
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
      createApp({
        clientDir: path.join(dir, "client"),
        handle: (req, res) => {
          if (req.url === "/big") return res.writeHead(200, { "Content-Type": "text/html" }).end("<p>stillpoint</p>".repeat(2000));
          res.writeHead(200, { "Content-Type": "text/plain" }).end(`app ${req.method} ${req.url}`);
        },
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
    expect(asset.headers["content-type"]).toMatch(/^(text|application)\/javascript/);
    expect(asset.headers["cache-control"]).toBe("public, max-age=31536000, immutable");
    const icon = await server.send("/favicon.svg");
    expect(icon.headers["content-type"]).toBe("image/svg+xml");
    expect(icon.headers["cache-control"]).toBe("public, max-age=0");
    expect(icon.headers.etag).toBeTruthy();
    const again = await server.send("/favicon.svg", { headers: { "If-None-Match": String(icon.headers.etag) } });
    expect(again.status).toBe(304);
  });

  it("compresses pages for clients that accept gzip, and only those", async () => {
    const page = "<p>stillpoint</p>".repeat(2000);
    const zipped = await server.send("/big", { headers: { "Accept-Encoding": "gzip" } });
    expect(zipped.headers["content-encoding"]).toBe("gzip");
    expect(zipped.raw.length).toBeLessThan(page.length / 10);
    expect(gunzipSync(zipped.raw).toString("utf8")).toBe(page);
    const plain = await server.send("/big", { headers: { "Accept-Encoding": "identity" } });
    expect(plain.headers["content-encoding"]).toBeUndefined();
    expect(plain.body).toBe(page);
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
      createApp({
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
      createApp({
        clientDir: path.join(os.tmpdir(), "stillpoint-no-client"),
        // As @react-router/express writes a response: res.append per header, Set-Cookie repeated.
        handle: (_req, res) => res.status(302).append("Location", "/next").append("Set-Cookie", "a=1").append("Set-Cookie", "b=2").append("Set-Cookie", "c=3").end(),
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

/**
 * The app side for this test: the real sign-in action behind a Fetch Request, with the load
 * context serve.ts builds (the client address after `trust proxy`).
 */
function signInHandler(action: Parameters<typeof run>[0]): RequestHandler {
  return (req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", async () => {
      const headers = new Headers();
      for (let i = 0; i < req.rawHeaders.length; i += 2) headers.append(req.rawHeaders[i]!, req.rawHeaders[i + 1]!);
      const request = new Request(`http://127.0.0.1${req.url}`, { method: req.method, headers, body: Buffer.concat(chunks) });
      const out = await run(action, request, {}, { clientAddress: clientAddressOf(req) });
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
    server = await listen(createApp({ clientDir: path.join(os.tmpdir(), "stillpoint-no-client"), handle: signInHandler(signIn.action) }));
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

describe("the client address under TRUST_PROXY", () => {
  const seen = async (trustProxy: false | number | string, from: string, headers: Record<string, string> = {}) => {
    const server = await listen(
      createApp({ clientDir: path.join(os.tmpdir(), "stillpoint-no-client"), trustProxy, handle: (req, res) => res.end(clientAddressOf(req) ?? "none") }),
    );
    try {
      return (await server.send("/labs", { from, headers })).body;
    } finally {
      await server.close();
    }
  };

  it("is the socket address, whatever X-Forwarded-For says, when no proxy is trusted", async () => {
    expect(await seen(false, "127.0.0.2", { "X-Forwarded-For": "10.0.0.1" })).toBe("127.0.0.2");
  });

  it("is the proxy's own appended entry with one trusted hop (earlier entries are client-supplied)", async () => {
    expect(await seen(1, "127.0.0.1", { "X-Forwarded-For": "203.0.113.9, 198.51.100.7" })).toBe("198.51.100.7");
    expect(await seen(1, "127.0.0.3")).toBe("127.0.0.3");
  });

  it("believes only the listed proxies", async () => {
    expect(await seen("127.0.0.1", "127.0.0.1", { "X-Forwarded-For": "198.51.100.7" })).toBe("198.51.100.7");
    expect(await seen("127.0.0.1", "127.0.0.4", { "X-Forwarded-For": "198.51.100.7" })).toBe("127.0.0.4");
  });
});

describe("same-origin check on every write, not only the API's", () => {
  let server: Awaited<ReturnType<typeof listen>>;
  let origin: string;
  const reached: string[] = [];
  beforeAll(async () => {
    server = await listen(
      createApp({
        clientDir: path.join(os.tmpdir(), "stillpoint-no-client"),
        appOrigins: ["https://stillpoint.example"],
        handle: (req, res) => {
          req.resume();
          req.on("end", () => {
            reached.push(`${req.method} ${req.url}`);
            res.writeHead(200, { "Content-Type": "text/plain" }).end("app");
          });
        },
      }),
    );
    origin = `http://127.0.0.1:${server.port}`;
  });
  afterAll(async () => server.close());

  const form = { "Content-Type": "application/x-www-form-urlencoded" };
  // One request of each class a browser can send with the session cookie attached.
  const classes: { what: string; path: string; headers: Record<string, string>; body: string }[] = [
    { what: "a page's form post (lab settings)", path: "/labs/alpha", headers: form, body: "intent=rename&name=X" },
    { what: "a page's multipart upload (new network)", path: "/labs/alpha/networks/new", headers: { "Content-Type": "multipart/form-data; boundary=XX" }, body: '--XX\r\nContent-Disposition: form-data; name="name"\r\n\r\nN\r\n--XX--\r\n' },
    { what: "a client-side submission (React Router .data)", path: "/labs/alpha/networks/n1.data", headers: form, body: "intent=archive" },
    { what: "an anonymous form (sign-in)", path: "/sign-in", headers: form, body: "email=a%40b.test" },
    { what: "sign-out", path: "/sign-out", headers: form, body: "" },
    { what: "a cookie API write", path: "/api/labs", headers: { "Content-Type": "application/json" }, body: '{"name":"L"}' },
    { what: "a text/plain post", path: "/labs/alpha/members", headers: { "Content-Type": "text/plain" }, body: "x" },
  ];

  for (const c of classes) {
    it(`refuses ${c.what} from another origin with 403, before the app sees it; accepts it from ours`, async () => {
      const before = reached.length;
      const foreign = await server.send(c.path, { method: "POST", headers: { ...c.headers, Origin: "http://127.0.0.1:4000" }, body: c.body });
      expect(foreign.status).toBe(403);
      expect(JSON.parse(foreign.body).error).toMatchObject({ code: "cross_origin", details: { origin: "http://127.0.0.1:4000" } });
      const fetchSite = await server.send(c.path, { method: "POST", headers: { ...c.headers, "Sec-Fetch-Site": "same-site" }, body: c.body });
      expect(fetchSite.status).toBe(403);
      expect(reached.length).toBe(before);

      const own = await server.send(c.path, { method: "POST", headers: { ...c.headers, Origin: origin, "Sec-Fetch-Site": "same-origin" }, body: c.body });
      expect(own.status).toBe(200);
      const proxied = await server.send(c.path, { method: "POST", headers: { ...c.headers, Origin: "https://stillpoint.example" }, body: c.body });
      expect(proxied.status).toBe(200);
      expect(reached.length).toBe(before + 2);
    });
  }

  it("lets reads, scripts without Origin and API-token clients through", async () => {
    expect((await server.send("/labs/alpha", { headers: { Origin: "http://127.0.0.1:4000" } })).status).toBe(200);
    expect((await server.send("/labs/alpha", { method: "POST", headers: form, body: "name=x" })).status).toBe(200);
    const token = await server.send("/api/labs", { method: "POST", headers: { "Content-Type": "application/json", Authorization: "Bearer stp_x", Origin: "http://127.0.0.1:4000" }, body: "{}" });
    expect(token.status).toBe(200);
  });
});
