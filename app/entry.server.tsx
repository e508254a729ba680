/**
 * How a page is rendered on the server: like React Router's default entry (renderToPipeableStream),
 * but the whole document is collected first and sent as one body. No page suspends (no <Await>,
 * no Suspense of our own), so waiting for everything costs nothing in time to first byte, and
 * one body instead of React's many small chunks means one compression pass and one socket write
 * per page instead of one for each chunk: under load that hand-off per chunk (to zlib's thread
 * and to the socket) was, after the database round trips, the largest cost of a page view
 * (bench/load.ts --profile).
 */
import { Writable } from "node:stream";
import type { AppLoadContext, EntryContext } from "react-router";
import { ServerRouter } from "react-router";
import { renderToPipeableStream } from "react-dom/server";

/** React Router's own default: abort a render that has not finished after this long. */
export const streamTimeout = 5_000;

export default function handleRequest(
  request: Request,
  responseStatusCode: number,
  responseHeaders: Headers,
  routerContext: EntryContext,
  _loadContext: AppLoadContext,
) {
  // https://httpwg.org/specs/rfc9110.html#HEAD
  if (request.method.toUpperCase() === "HEAD") return new Response(null, { status: responseStatusCode, headers: responseHeaders });

  return new Promise<Response>((resolve, reject) => {
    let shellRendered = false;
    const chunks: Buffer[] = [];
    const timeout = setTimeout(() => abort(), streamTimeout + 1000);
    const sink = new Writable({
      write(chunk: Buffer | string, _encoding, callback) {
        chunks.push(typeof chunk === "string" ? Buffer.from(chunk) : chunk);
        callback();
      },
      final(callback) {
        clearTimeout(timeout);
        responseHeaders.set("Content-Type", "text/html; charset=utf-8");
        resolve(new Response(Buffer.concat(chunks), { headers: responseHeaders, status: responseStatusCode }));
        callback();
      },
    });
    const { pipe, abort } = renderToPipeableStream(<ServerRouter context={routerContext} url={request.url} />, {
      onAllReady() {
        shellRendered = true;
        pipe(sink);
      },
      onShellError(error: unknown) {
        clearTimeout(timeout);
        reject(error);
      },
      onError(error: unknown) {
        responseStatusCode = 500;
        // Errors of the shell itself reject above and are logged by React Router.
        if (shellRendered) console.error(error);
      },
    });
  });
}
