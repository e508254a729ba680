import type { Route } from "./+types/me";
import { apiError } from "~/permissions/api-errors";
import { db } from "~/db.server";
import { listLabsOf } from "~/labs/labs.server";
import { requireApiUser } from "~/permissions/permissions.server";

/** GET /api/me — who the token (or session) acts as, and their labs with roles. */
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireApiUser(request);
  const labs = await listLabsOf(db(), user.id);
  return Response.json({
    user: { id: user.id, email: user.email, displayName: user.displayName, isSiteAdmin: user.isSiteAdmin },
    labs: labs.map((l) => ({ slug: l.slug, name: l.name, role: l.role })),
  });
}

/** Read-only resource: other methods get the JSON error shape (after the same permission check). */
export async function action({ request }: Route.ActionArgs) {
  await requireApiUser(request);
  throw apiError("method_not_allowed", "This resource is read-only; use GET.", undefined, { Allow: "GET" });
}
