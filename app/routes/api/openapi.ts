import type { Route } from "./+types/openapi";
import { openApiDocument } from "~/api/openapi";
import { requireApiUser } from "~/permissions/permissions.server";
import pkg from "../../../package.json";

/** GET /api/openapi.json — the OpenAPI 3.1 description of this API (any signed-in caller, token or cookie). */
export async function loader({ request }: Route.LoaderArgs) {
  await requireApiUser(request);
  return Response.json(openApiDocument(pkg.version), { headers: { "Cache-Control": "no-store" } });
}
