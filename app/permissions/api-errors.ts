/**
 * The one error shape of the JSON API: `{ error: { code, message, details? } }`.
 * Route modules throw or return these; clients branch on `code`, people read `message`.
 */
export type ApiErrorCode =
  | "unauthenticated"
  | "invalid_token"
  | "forbidden"
  | "not_found"
  | "invalid_request"
  | "conflict"
  | "rate_limited"
  | "method_not_allowed"
  | "cross_origin"
  | "unsupported_media_type"
  | "payload_too_large"
  | "unavailable";

export interface ApiErrorBody {
  error: { code: ApiErrorCode; message: string; details?: unknown };
}

const STATUS: Record<ApiErrorCode, number> = {
  unauthenticated: 401,
  invalid_token: 401,
  forbidden: 403,
  not_found: 404,
  invalid_request: 400,
  conflict: 409,
  rate_limited: 429,
  method_not_allowed: 405,
  cross_origin: 403,
  unsupported_media_type: 415,
  payload_too_large: 413,
  unavailable: 503,
};

/** The HTTP status of an error code, for pages that answer a form with `data(…, { status })`. */
export function apiStatus(code: ApiErrorCode): number {
  return STATUS[code];
}

export function apiError(code: ApiErrorCode, message: string, details?: unknown, headers?: HeadersInit): Response {
  const body: ApiErrorBody = { error: details === undefined ? { code, message } : { code, message, details } };
  const h = new Headers(headers);
  if (code === "unauthenticated" || code === "invalid_token") {
    // RFC 6750 §3: tell the client which scheme we expect.
    h.set("WWW-Authenticate", code === "invalid_token" ? 'Bearer error="invalid_token"' : "Bearer");
  }
  return Response.json(body, { status: STATUS[code], headers: h });
}
