import type { Route } from "./+types/not-found";
import { apiError } from "~/permissions/api-errors";

/**
 * Any unknown path under /api/: the JSON error shape, never the HTML 404 page (a client of the API
 * parses every answer as JSON). The same for every method.
 */
function notFound(request: Request): Response {
  const path = new URL(request.url).pathname;
  return apiError("not_found", `No API route ${request.method} ${path}.`, { path });
}

export function loader({ request }: Route.LoaderArgs) {
  return notFound(request);
}

export function action({ request }: Route.ActionArgs) {
  return notFound(request);
}
