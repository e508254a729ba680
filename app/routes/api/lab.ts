import type { Route } from "./+types/lab";
import { apiError } from "~/permissions/api-errors";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug — the lab and the caller's role (members, and guests of a public lab; others get 404). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const { lab, role, guest } = await requireApiLabRole(request, params.labSlug, "viewer");
  return Response.json({ lab: { slug: lab.slug, name: lab.name, public: lab.isPublic }, role, guest });
}

/** Read-only resource: other methods get the JSON error shape (after the same permission check). */
export async function action({ request, params }: Route.ActionArgs) {
  await requireApiLabRole(request, params.labSlug, "viewer");
  throw apiError("method_not_allowed", "This resource is read-only; use GET.", undefined, { Allow: "GET" });
}
