import type { Route } from "./+types/lab";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug — the lab and the caller's role (members only; others get 404). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const { lab, role } = await requireApiLabRole(request, params.labSlug, "viewer");
  return Response.json({ lab: { slug: lab.slug, name: lab.name }, role });
}
