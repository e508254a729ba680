/**
 * What the production server checks before the app sees a request (scripts/serve.ts):
 *
 * - a body limit per route, enforced before and while reading: a declared Content-Length over the
 *   limit is refused unread, and a chunked body is counted as it arrives and cut off at the limit
 *   (413 in the API's error shape). Anonymous routes (sign-in) get the smallest limit.
 * - no NUL characters in a body (PostgreSQL cannot store them): 400 naming the field.
 * - security headers on every response.
 *
 * Limits: network uploads 640 KiB (a 256 KB network file, twice over for JSON escaping or
 * multipart framing, as app/networks/api.server.ts allows); sign-in and invitation pages 16 KiB;
 * every other write 64 KiB.
 */

export const BODY_LIMITS = {
  upload: 640 * 1024,
  anonymous: 16 * 1024,
  default: 64 * 1024,
} as const;

const UPLOAD_PATHS = [
  /^\/labs\/[^/]+\/networks\/new$/,
  /^\/labs\/[^/]+\/networks\/[^/]+\/edit$/,
  /^\/labs\/[^/]+\/networks\/[^/]+$/,
  /^\/api\/labs\/[^/]+\/networks$/,
  /^\/api\/labs\/[^/]+\/networks\/[^/]+\/versions$/,
];
const ANONYMOUS_PATHS = [/^\/sign-in(\/verify|\/magic)?$/, /^\/welcome$/, /^\/invitations\/[^/]+$/, /^\/sign-out$/, /^\/$/, /^\/_root$/];

/** The body limit, in bytes, for a write to `pathname` (React Router's `.data` suffix ignored). */
export function bodyLimitFor(pathname: string): number {
  const path = pathname.replace(/\.data$/, "").replace(/\/+$/, "") || "/";
  if (UPLOAD_PATHS.some((p) => p.test(path))) return BODY_LIMITS.upload;
  if (ANONYMOUS_PATHS.some((p) => p.test(path))) return BODY_LIMITS.anonymous;
  return BODY_LIMITS.default;
}

/**
 * Where a NUL character sits in a body, named for a person ("field `name`", "JSON at
 * `network.name`", "part `file`"), or undefined when there is none. Looks for the raw byte,
 * `%00` in form encoding and `\u0000` in JSON.
 *
 *   nulLocation("application/x-www-form-urlencoded", Buffer.from("name=a%00b")) // "field `name`"
 */
export function nulLocation(contentType: string, body: Buffer): string | undefined {
  const type = contentType.split(";")[0]!.trim().toLowerCase();
  if (type === "application/x-www-form-urlencoded") {
    const text = body.toString("latin1");
    if (!text.includes("\0") && !/%00/i.test(text)) return undefined;
    for (const [key, value] of new URLSearchParams(body.toString("utf8"))) {
      if (key.includes("\0") || value.includes("\0")) return `field \`${key.replace(/\0/g, "\\0")}\``;
    }
    return "the form body";
  }
  if (type === "application/json" || type.endsWith("+json")) {
    const text = body.toString("utf8");
    if (!text.includes("\0") && !/\\u0000/i.test(text)) return undefined;
    try {
      const path = nulPath(JSON.parse(text), "");
      return path === undefined ? "the JSON body" : `JSON at \`${path || "(top)"}\``;
    } catch {
      return "the JSON body";
    }
  }
  const at = body.indexOf(0);
  if (at < 0) return undefined;
  if (type === "multipart/form-data") {
    const before = body.subarray(0, at).toString("latin1");
    const names = [...before.matchAll(/[;\s]name="([^"]*)"/g)];
    const name = names.at(-1)?.[1];
    if (name !== undefined) return `part \`${name}\``;
  }
  return `byte ${at + 1} of the body`;
}

/**
 * When the first NUL of a multipart body lies in an uploaded file (a part with a `filename`), where
 * it sits in that file: a NUL there means a binary file, which deserves that name rather than
 * "remove the character". Byte and line are 1-based within the file.
 *
 *   binaryFilePart("multipart/form-data; boundary=X", body) // { filename: "a.csv", byte: 12, line: 2 }
 */
export function binaryFilePart(contentType: string, body: Buffer): { filename: string; byte: number; line: number } | undefined {
  if (contentType.split(";")[0]!.trim().toLowerCase() !== "multipart/form-data") return undefined;
  const at = body.indexOf(0);
  if (at < 0) return undefined;
  const before = body.subarray(0, at).toString("latin1");
  const headerEnd = before.lastIndexOf("\r\n\r\n");
  if (headerEnd < 0) return undefined;
  const headers = before.slice(before.lastIndexOf("\r\n--", headerEnd) + 2, headerEnd);
  const filename = /filename="([^"]*)"/i.exec(headers)?.[1];
  if (filename === undefined) return undefined;
  const inFile = before.slice(headerEnd + 4);
  return { filename, byte: inFile.length + 1, line: inFile.split(/\r\n|\n|\r/).length };
}

function nulPath(value: unknown, path: string): string | undefined {
  if (typeof value === "string") return value.includes("\0") ? path : undefined;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const p = nulPath(value[i], `${path}[${i}]`);
      if (p !== undefined) return p;
    }
    return undefined;
  }
  if (value && typeof value === "object") {
    for (const [k, v] of Object.entries(value)) {
      const here = path ? `${path}.${k}` : k;
      if (k.includes("\0")) return here;
      const p = nulPath(v, here);
      if (p !== undefined) return p;
    }
  }
  return undefined;
}

/**
 * Headers on every response. Scripts and styles only from this site; React Router's hydration
 * data and KaTeX/chart styles are inline, hence 'unsafe-inline' for those two (no third-party
 * origin is allowed anywhere). Pages cannot be framed (clickjacking), types are not sniffed, and
 * other sites learn only our origin from links.
 */
export const SECURITY_HEADERS: Record<string, string> = {
  "Content-Security-Policy": [
    "default-src 'self'",
    "script-src 'self' 'unsafe-inline'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; "),
  "X-Frame-Options": "DENY",
  "X-Content-Type-Options": "nosniff",
  "Referrer-Policy": "strict-origin-when-cross-origin",
  "Cross-Origin-Opener-Policy": "same-origin",
};

/** A JSON error body in the API's one shape (app/permissions/api-errors.ts). */
export function errorBody(code: string, message: string, details?: unknown): string {
  return JSON.stringify({ error: details === undefined ? { code, message } : { code, message, details } });
}
