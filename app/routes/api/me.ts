import type { Route } from "./+types/me";
import { apiError } from "~/permissions/api-errors";
import { db } from "~/db.server";
import { listLabsOf, listPublicLabs } from "~/labs/labs.server";
import { requireApiUser } from "~/permissions/permissions.server";

/** GET /api/me — who the token (or session) acts as, their labs with roles, and the public labs they may read. */
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireApiUser(request);
  const [labs, publicLabs] = await Promise.all([listLabsOf(db(), user.id), listPublicLabs(db())]);
  return Response.json({
    user: { id: user.id, email: user.email, displayName: user.displayName, isSiteAdmin: user.isSiteAdmin },
    labs: labs.map((l) => ({ slug: l.slug, name: l.name, role: l.role })),
    publicLabs: publicLabs.map((l) => ({ slug: l.slug, name: l.name, networks: l.networkCount })),
  });
}

/** Read-only resource: other methods get the JSON error shape (after the same permission check). */
export async function action({ request }: Route.ActionArgs) {
  await requireApiUser(request);
  throw apiError("method_not_allowed", "This resource is read-only; use GET.", undefined, { Allow: "GET" });
}
