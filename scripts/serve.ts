/**
 * The production server: `tsx scripts/serve.ts [build/server/index.js]` on HOST:PORT, an express
 * app around @react-router/express's request handler. In order, every request gets:
 *
 * 1. the security headers (request-guards.ts);
 * 2. compression (gzip/deflate/br as the client accepts, at COMPRESSION_LEVEL; already-compressed
 *    types such as woff2 are left alone);
 * 3. static files from build/client: hashed files under /assets/ with a one-year immutable cache,
 *    other files revalidated (ETag, Last-Modified);
 * 4. for writes (every method but GET, HEAD, OPTIONS): the same-origin check, pages' form posts
 *    included (app/permissions/same-origin.ts: a foreign Origin is refused with 403 before the
 *    body is read), then, once the request's turn has come (at most REQUESTS_IN_PROGRESS at once,
 *    the rest in arrival order: lib/admission.ts), the body limit of its route and the NUL check
 *    (request-guards.ts);
 * 5. the app, with the client's address in its load context (app/load-context.ts) for the
 *    per-client limits. `TRUST_PROXY` is express's `trust proxy` setting: unset, the socket
 *    address counts and X-Forwarded-For is ignored; a hop count (`1` behind one reverse proxy) or a
 *    list of proxy addresses (`loopback, 10.0.0.0/8`) says which X-Forwarded-For entries to believe.
 */
import { readdirSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { Readable } from "node:stream";
import { pathToFileURL } from "node:url";
import compression from "compression";
import express, { type Application, type NextFunction, type Request, type RequestHandler, type Response } from "express";
import type { ServerBuild } from "react-router";
import type { ServerLoadContext } from "../app/load-context";
import { CROSS_ORIGIN_MESSAGE, crossOriginWrite } from "../app/permissions/same-origin";
import { admission, requestsInProgress } from "./lib/admission";
import { startCpuProfile } from "./lib/cpu-profile";
import { isClusterWorker, superviseWorkers, webProcesses } from "./lib/web-cluster";
import { binaryFilePart, bodyLimitFor, errorBody, nulLocation, SECURITY_HEADERS } from "./lib/request-guards";

/** express's `trust proxy` value from TRUST_PROXY: false, a hop count, or a list of addresses. */
export type TrustProxy = false | number | string;

/**
 *   parseTrustProxy(undefined)   // false: believe no X-Forwarded-For
 *   parseTrustProxy("1")         // 1: one proxy in front; its appended entry is the client
 *   parseTrustProxy("loopback")  // "loopback": believe proxies on 127.0.0.0/8 and ::1
 * "true" (believe every hop, so any client could pick its own address) is refused.
 */
export function parseTrustProxy(raw: string | undefined): TrustProxy {
  const value = raw?.trim() ?? "";
  if (value === "" || value === "0" || value.toLowerCase() === "false") return false;
  if (/^\d+$/.test(value)) return Number(value);
  if (value.toLowerCase() === "true") {
    throw new Error('TRUST_PROXY=true would let any client choose its own address; give the number of proxies in front (e.g. 1) or their addresses');
  }
  return value;
}

/** The client's address as express sees it under `trust proxy`, IPv4-mapped IPv6 shortened. */
export function clientAddressOf(req: Request): string | undefined {
  const ip = req.ip ?? req.socket.remoteAddress;
  return ip ? ip.replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/, "$1") : undefined;
}

/**
 * zlib level 3 instead of the default 6: on our pages about a third of the CPU time for an answer
 * about 13 % larger (a 135 KB network page: 17.8 KB instead of 15.7 KB), measured in
 * `bench --load`. A page is compressed on every view, so this is paid per request. Answers under
 * 1 KB (compression's threshold) are sent as they are.
 */
export const COMPRESSION_LEVEL = 3;

/** Adds SECURITY_HEADERS before anything is written; the app's own headers are appended after. */
function securityHeaders(_req: Request, res: Response, next: NextFunction) {
  for (const [name, value] of Object.entries(SECURITY_HEADERS)) res.setHeader(name, value);
  next();
}

/** Answers with the API's error shape and stops reading whatever the client is still sending. */
function refuse(req: Request, res: Response, status: number, body: string) {
  if (res.headersSent) return;
  res.writeHead(status, { "Content-Type": "application/json; charset=utf-8", Connection: "close" });
  res.end(body, () => req.destroy());
}

const READS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Refuses a write whose Origin (or Sec-Fetch-Site) says another site's page sent it: the browser
 * would have attached our session cookie. Requests with an Authorization header are API-token
 * clients (a browser sends that header cross-origin only after a CORS preflight, which this
 * server never grants) and pass; the API checks them itself.
 */
function sameOriginWrites(appOrigins: readonly string[]) {
  return (req: Request, res: Response, next: NextFunction) => {
    if (READS.has(req.method ?? "GET") || req.headers.authorization !== undefined) return next();
    const own = [`${req.protocol}://${req.get("host") ?? ""}`, ...appOrigins];
    const foreign = crossOriginWrite(req.method ?? "POST", { origin: req.get("origin"), fetchSite: req.get("sec-fetch-site") }, own);
    if (!foreign) return next();
    refuse(req, res, 403, errorBody("cross_origin", CROSS_ORIGIN_MESSAGE, foreign));
  };
}

/**
 * For writes: reads the body up to the route's limit (refusing a larger declared length unread
 * and cutting a chunked body off at the limit), refuses NUL characters, and hands the next
 * handler a request whose body is the bytes read. Everything but the body (headers, socket, the
 * express app) is the original request's: the stand-in inherits from it.
 */
function guardBody(handle: RequestHandler): RequestHandler {
  return (req, res, next) => {
    if (READS.has(req.method ?? "GET")) return handle(req, res, next);
    readBounded(req, res, (guarded) => handle(guarded, res, next));
  };
}

function readBounded(req: Request, res: Response, then: (guarded: Request) => void) {
  const limit = bodyLimitFor(req.path);
  const tooLarge = () => errorBody("payload_too_large", `The request body is larger than this address accepts (${Math.round(limit / 1024)} KiB).`, { limitBytes: limit });
  if (Number(req.headers["content-length"] ?? 0) > limit) return refuse(req, res, 413, tooLarge());
  const chunks: Buffer[] = [];
  let size = 0;
  let done = false;
  req.on("data", (chunk: Buffer) => {
    if (done) return;
    size += chunk.length;
    if (size > limit) {
      done = true;
      req.pause();
      refuse(req, res, 413, tooLarge());
      return;
    }
    chunks.push(chunk);
  });
  req.on("error", () => (done = true));
  req.on("end", () => {
    if (done) return;
    done = true;
    const body = Buffer.concat(chunks);
    const nul = nulLocation(String(req.headers["content-type"] ?? ""), body);
    if (nul) {
      // A NUL inside an uploaded file means a binary file: say so, with where it sits in that file.
      const file = binaryFilePart(String(req.headers["content-type"] ?? ""), body);
      const message = file
        ? `${file.filename || "The uploaded file"}: this is not a text file: binary content at byte ${file.byte} (0x00, line ${file.line}); nothing was saved.`
        : `The request contains a NUL character in ${nul}; remove it and send again.`;
      return refuse(req, res, 400, errorBody("invalid_request", message, file ? { where: nul, problems: [{ row: file.line, message: `this is not a text file: binary content at byte ${file.byte} (0x00, line ${file.line})`, expected: "a text file in UTF-8, such as a CSV saved from a spreadsheet or a text editor" }] } : { where: nul }));
    }
    const stream = new Readable({
      read() {
        if (body.length > 0) this.push(body);
        this.push(null);
      },
    });
    // Own stream state, everything else (method, url, headers, socket, app) looked up on req.
    Object.setPrototypeOf(stream, req);
    then(stream as unknown as Request);
  });
}

export interface AppOptions {
  /** Where the browser files are (build/client). */
  clientDir: string;
  /** The URL prefix they are served under (the build's publicPath, usually "/"). */
  publicPath?: string;
  trustProxy?: TrustProxy;
  /** Origins besides the one a request arrived on that count as ours (APP_URL's, behind a proxy). */
  appOrigins?: readonly string[];
  /** Everything that is not a static file: the SSR handler (express-style). */
  handle: RequestHandler;
  /** At most this many app requests in progress at once, the rest queued in order (scripts/lib/admission.ts); 0 or unset: no limit. */
  requestsInProgress?: number;
}

/** The files and folders directly in `dir` (none when it does not exist), besides assets/. */
function topLevelNames(dir: string): Set<string> {
  try {
    return new Set(readdirSync(dir).filter((name) => name !== "assets"));
  } catch {
    return new Set();
  }
}

function decodeFirstSegment(p: string): string {
  const first = p.split("/")[1] ?? "";
  try {
    return decodeURIComponent(first);
  } catch {
    return first;
  }
}

/** The express app: security headers, compression, static files, same-origin writes, body limits, then the app. */
export function createApp(options: AppOptions): Application {
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", options.trustProxy ?? false);
  const publicPath = (options.publicPath || "/").replace(/\/?$/, "/");
  const clientDir = path.resolve(options.clientDir);
  app.use(securityHeaders);
  app.use(compression({ level: COMPRESSION_LEVEL }));
  app.use(
    `${publicPath}assets`,
    express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "1y", index: false, redirect: false }),
  );
  // Only for names that are there (favicon.svg, …): looking every page and API path up on disk
  // first cost a failed stat and an error object per request.
  const topLevel = topLevelNames(clientDir);
  const files = express.static(clientDir, { maxAge: 0, index: false, redirect: false });
  app.use(publicPath, (req: Request, res: Response, next: NextFunction) => (topLevel.has(decodeFirstSegment(req.path)) ? files(req, res, next) : next()));
  app.use(sameOriginWrites(options.appOrigins ?? []));
  // After the cheap refusals (cross-origin, static files), before anything reads a body or the database.
  if (options.requestsInProgress) app.use(admission(options.requestsInProgress));
  app.use(guardBody(options.handle));
  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    console.error("[serve] unhandled:", err instanceof Error ? (err.stack ?? err.message) : err);
    if (res.headersSent) return res.destroy();
    res.writeHead(500, { "Content-Type": "application/json; charset=utf-8" });
    res.end(errorBody("internal", "Something went wrong on our side; nothing was changed. Please try again."));
  });
  return app;
}

function appOrigin(appUrl: string | undefined): string[] {
  try {
    return appUrl ? [new URL(appUrl).origin] : [];
  } catch {
    return [];
  }
}

/** An HTTP server (not yet listening) for the server build at `entry` (build/server/index.js). */
export async function createAppServer(entry: string, options: { trustProxy?: TrustProxy } = {}): Promise<http.Server> {
  // Loaded here, not at the top, so NODE_ENV is settled before React is (dev and prod builds must not mix).
  process.env.NODE_ENV ??= "production";
  const { createRequestHandler } = await import("@react-router/express");
  const file = path.resolve(entry);
  const build = (await import(pathToFileURL(file).href)) as ServerBuild;
  const app = createApp({
    // Beside the server entry, so a build made into another folder (npm test) serves its own files.
    clientDir: path.join(path.dirname(file), "..", "client"),
    publicPath: build.publicPath,
    trustProxy: options.trustProxy,
    appOrigins: appOrigin(process.env.APP_URL),
    requestsInProgress: requestsInProgress(process.env.REQUESTS_IN_PROGRESS),
    handle: createRequestHandler({
      build,
      mode: process.env.NODE_ENV,
      getLoadContext: (req) => ({ clientAddress: clientAddressOf(req) }) satisfies ServerLoadContext,
    }) as RequestHandler,
  });
  return http.createServer(app);
}

async function main() {
  const entry = process.argv[2] ?? "build/server/index.js";
  const host = process.env.HOST || "127.0.0.1";
  const port = Number(process.env.PORT ?? 3000);
  if (!Number.isInteger(port) || port <= 0 || port > 65535) throw new Error(`PORT must be a port number, not "${process.env.PORT}"`);
  const trustProxy = parseTrustProxy(process.env.TRUST_PROXY);
  const processes = webProcesses(process.env.WEB_PROCESSES);
  if (processes > 1 && !isClusterWorker()) {
    console.log(`[serve] http://${host}:${port}: ${processes} web processes (WEB_PROCESSES)`);
    await superviseWorkers({ processes });
    process.exit(0);
  }
  const stopProfile = await startCpuProfile(process.env.CPU_PROFILE_DIR);
  const server = await createAppServer(entry, { trustProxy });
  server.listen(port, host, () => {
    if (isClusterWorker()) return;
    console.log(`[serve] http://${host}:${port}${trustProxy === false ? "" : ` (trust proxy: ${trustProxy})`}`);
  });
  const stop = () => {
    server.close(() => void (stopProfile?.() ?? Promise.resolve()).finally(() => process.exit(0)));
    server.closeAllConnections();
  };
  process.once("SIGTERM", stop);
  process.once("SIGINT", stop);
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? "").href) {
  main().catch((err) => {
    console.error(`[serve] ${err instanceof Error ? err.message : err}`);
    process.exit(1);
  });
}
