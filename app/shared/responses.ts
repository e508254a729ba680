/**
 * The one way a page route, loader or download answers "not found": a thrown 404 that the
 * error boundary renders. Also used for ids of other labs, so existence does not leak.
 * (JSON API routes answer with `apiError("not_found", …)` from app/permissions/api-errors.ts.)
 */
export function notFound(message = "Not found"): Response {
  return new Response(message, { status: 404, statusText: "Not Found" });
}
