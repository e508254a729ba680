/**
 * The production server: `tsx scripts/serve.ts [build/server/index.js]` on HOST:PORT.
 * It does what `react-router-serve` does (hashed assets from build/client/assets with a one-year
 * immutable cache, other files from build/client, everything else to the SSR handler) and one
 * thing it cannot: tell the app who is connecting. React Router's Request carries no socket
 * address, so the per-client sign-in limit (app/auth/client-key.server.ts) reads X-Forwarded-For;
 * here that header is overwritten with the socket address, unless TRUST_PROXY=1 says a reverse
 * proxy in front sets it. Without this, every client would share one allowance.
 */
import { createReadStream, type Stats, statSync } from "node:fs";
import http from "node:http";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { Readable } from "node:stream";
import type { ServerBuild } from "react-router";
import { binaryFilePart, bodyLimitFor, errorBody, nulLocation, SECURITY_HEADERS } from "./lib/request-guards";

const CONTENT_TYPES: Record<string, string> = {
  ".js": "text/javascript; charset=utf-8",
  ".mjs": "text/javascript; charset=utf-8",
  ".css": "text/css; charset=utf-8",
  ".map": "application/json; charset=utf-8",
  ".json": "application/json; charset=utf-8",
  ".webmanifest": "application/manifest+json",
  ".html": "text/html; charset=utf-8",
  ".txt": "text/plain; charset=utf-8",
  ".svg": "image/svg+xml",
  ".png": "image/png",
  ".jpg": "image/jpeg",
  ".ico": "image/x-icon",
  ".woff": "font/woff",
  ".woff2": "font/woff2",
  ".ttf": "font/ttf",
};

/**
 * Makes X-Forwarded-For name the connecting socket, unless a trusted proxy set it.
 * The IPv4-mapped IPv6 form (::ffff:127.0.0.1) is shortened to the IPv4 address.
 */
export function setClientAddress(req: http.IncomingMessage, trustProxy: boolean): void {
  if (trustProxy && req.headers["x-forwarded-for"]) return;
  const address = (req.socket.remoteAddress ?? "").replace(/^::ffff:(\d+\.\d+\.\d+\.\d+)$/, "$1");
  // React Router builds its Request from rawHeaders (name, value, name, value, …).
  const kept: string[] = [];
  for (let i = 0; i + 1 < req.rawHeaders.length; i += 2) {
    if (req.rawHeaders[i].toLowerCase() !== "x-forwarded-for") kept.push(req.rawHeaders[i], req.rawHeaders[i + 1]);
  }
  delete req.headers["x-forwarded-for"];
  if (address) {
    kept.push("X-Forwarded-For", address);
    req.headers["x-forwarded-for"] = address;
  }
  req.rawHeaders.splice(0, req.rawHeaders.length, ...kept);
}

/** The file under `root` that `urlPath` names, or undefined (missing, a folder, or outside root). */
function staticFile(root: string, urlPath: string): { file: string; stat: Stats } | undefined {
  let decoded: string;
  try {
    decoded = decodeURIComponent(urlPath);
  } catch {
    return undefined;
  }
  if (decoded.includes("\0")) return undefined;
  const file = path.join(root, path.normalize(decoded));
  if (!file.startsWith(root + path.sep)) return undefined;
  try {
    const stat = statSync(file);
    return stat.isFile() ? { file, stat } : undefined;
  } catch {
    return undefined;
  }
}

function sendFile(req: http.IncomingMessage, res: http.ServerResponse, found: { file: string; stat: Stats }, immutable: boolean) {
  const lastModified = found.stat.mtime.toUTCString();
  res.setHeader("Content-Type", CONTENT_TYPES[path.extname(found.file).toLowerCase()] ?? "application/octet-stream");
  res.setHeader("Cache-Control", immutable ? "public, max-age=31536000, immutable" : "public, max-age=0");
  res.setHeader("Last-Modified", lastModified);
  if (!immutable && req.headers["if-modified-since"] === lastModified) {
    res.statusCode = 304;
    res.end();
    return;
  }
  res.setHeader("Content-Length", String(found.stat.size));
  if (req.method === "HEAD") {
    res.end();
    return;
  }
  createReadStream(found.file).pipe(res);
}

export interface ListenerOptions {
  /** Where the browser files are (build/client). */
  clientDir: string;
  /** The URL prefix they are served under (the build's publicPath, usually "/"). */
  publicPath?: string;
  trustProxy?: boolean;
  /** Everything that is not a static file: the SSR handler. */
  handle: http.RequestListener;
}

/** Answers with the API's error shape and stops reading whatever the client is still sending. */
function refuse(req: http.IncomingMessage, res: http.ServerResponse, status: number, body: string) {
  if (res.headersSent) return;
  res.writeHead(status, { "Content-Type": "application/json; charset=utf-8", Connection: "close" });
  res.end(body, () => req.destroy());
}

/**
 * Reads a write's body up to the route's limit (refusing a larger declared length unread and
 * cutting a chunked body off at the limit), refuses NUL characters, and hands the app a copy of
 * the request whose body is the bytes read. Resolves undefined when it has answered itself.
 */
function guardBody(req: http.IncomingMessage, res: http.ServerResponse): Promise<http.IncomingMessage | undefined> {
  const pathname = (req.url ?? "/").split("?")[0]!;
  const limit = bodyLimitFor(pathname);
  const tooLarge = () => errorBody("payload_too_large", `The request body is larger than this address accepts (${Math.round(limit / 1024)} KiB).`, { limitBytes: limit });
  const declared = Number(req.headers["content-length"] ?? 0);
  if (declared > limit) {
    refuse(req, res, 413, tooLarge());
    return Promise.resolve(undefined);
  }
  return new Promise((resolve) => {
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
        resolve(undefined);
        return;
      }
      chunks.push(chunk);
    });
    req.on("error", () => {
      if (!done) resolve(undefined);
      done = true;
    });
    req.on("end", () => {
      if (done) return;
      done = true;
      const body = Buffer.concat(chunks);
      const nul = nulLocation(String(req.headers["content-type"] ?? ""), body);
      if (nul) {
        const file = binaryFilePart(String(req.headers["content-type"] ?? ""), body);
        const message = file
          ? `${file.filename || "The uploaded file"}: this is not a text file: binary content at byte ${file.byte} (0x00, line ${file.line}); nothing was saved.`
          : `The request contains a NUL character in ${nul}; remove it and send again.`;
        refuse(req, res, 400, errorBody("invalid_request", message, file ? { where: nul, problems: [{ row: file.line, message: `this is not a text file: binary content at byte ${file.byte} (0x00, line ${file.line})`, expected: "a text file in UTF-8, such as a CSV saved from a spreadsheet or a text editor" }] } : { where: nul }));
        return resolve(undefined);
      }
      // The app reads the body from this copy; everything else is the original request's.
      const copy = Readable.from(body.length > 0 ? [body] : []) as unknown as http.IncomingMessage;
      Object.assign(copy, { method: req.method, url: req.url, headers: req.headers, rawHeaders: req.rawHeaders, socket: req.socket, httpVersion: req.httpVersion });
      resolve(copy);
    });
  });
}

const READS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Adds SECURITY_HEADERS to whatever the response writes, at writeHead time. Not with setHeader up
 * front: Node merges a later writeHead(status, [name, value, …]) into set headers one setHeader
 * at a time, so of several Set-Cookie lines (the sign-in sets three) only the last would survive.
 */
function addSecurityHeaders(res: http.ServerResponse): void {
  const original = res.writeHead.bind(res) as (...args: unknown[]) => http.ServerResponse;
  res.writeHead = ((status: number, ...rest: unknown[]) => {
    const headersAt = typeof rest[0] === "string" ? 1 : 0;
    const headers = rest[headersAt];
    const has = (name: string) =>
      Array.isArray(headers)
        ? headers.some((h, i) => i % 2 === 0 && String(h).toLowerCase() === name.toLowerCase())
        : headers && typeof headers === "object"
          ? Object.keys(headers).some((k) => k.toLowerCase() === name.toLowerCase())
          : res.hasHeader(name);
    const missing = Object.entries(SECURITY_HEADERS).filter(([name]) => !has(name));
    if (Array.isArray(headers)) rest[headersAt] = [...headers, ...missing.flat()];
    else if (headers && typeof headers === "object") rest[headersAt] = { ...headers, ...Object.fromEntries(missing) };
    else for (const [name, value] of missing) res.setHeader(name, value);
    return original(status, ...rest);
  }) as typeof res.writeHead;
}

/** The request listener: security headers and client address first, then static files, then body limits, then the app. */
export function appListener(options: ListenerOptions): http.RequestListener {
  const clientDir = path.resolve(options.clientDir);
  const assetsDir = path.join(clientDir, "assets");
  const publicPath = options.publicPath || "/";
  return (req, res) => {
    addSecurityHeaders(res);
    setClientAddress(req, options.trustProxy ?? false);
    if (req.method === "GET" || req.method === "HEAD") {
      const pathname = (req.url ?? "/").split("?")[0];
      if (pathname.startsWith(publicPath)) {
        const rest = "/" + pathname.slice(publicPath.length);
        const asset = rest.startsWith("/assets/") ? staticFile(assetsDir, rest.slice("/assets".length)) : undefined;
        const found = asset ?? staticFile(clientDir, rest);
        if (found) return sendFile(req, res, found, asset !== undefined);
      }
    }
    if (READS.has(req.method ?? "GET")) return void options.handle(req, res);
    void guardBody(req, res).then((guarded) => {
      if (guarded) void options.handle(guarded, res);
    });
  };
}

/** An HTTP server (not yet listening) for the server build at `entry` (build/server/index.js). */
export async function createAppServer(entry: string, options: { trustProxy?: boolean } = {}): Promise<http.Server> {
  // Loaded here, not at the top, so NODE_ENV is settled before React is (dev and prod builds must not mix).
  process.env.NODE_ENV ??= "production";
  const { createRequestListener } = await import("@react-router/node");
  const file = path.resolve(entry);
  const build = (await import(pathToFileURL(file).href)) as ServerBuild;
  return http.createServer(
    appListener({
      // Beside the server entry, so a build made into another folder (npm test) serves its own files.
      clientDir: path.join(path.dirname(file), "..", "client"),
      publicPath: build.publicPath,
      trustProxy: options.trustProxy,
      handle: createRequestListener({ build, mode: process.env.NODE_ENV }),
    }),
  );
}

async function main() {
  const entry = process.argv[2] ?? "build/server/index.js";
  const host = process.env.HOST || "127.0.0.1";
  const port = Number(process.env.PORT ?? 3000);
  if (!Number.isInteger(port) || port <= 0 || port > 65535) throw new Error(`PORT must be a port number, not "${process.env.PORT}"`);
  const server = await createAppServer(entry, { trustProxy: process.env.TRUST_PROXY === "1" });
  server.listen(port, host, () => console.log(`[serve] http://${host}:${port}${process.env.TRUST_PROXY === "1" ? " (trusting X-Forwarded-For from a proxy)" : ""}`));
  const stop = () => {
    server.close(() => process.exit(0));
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
