import { redirect } from "react-router";
import type { Route } from "./+types/analyses-home";
import { analysesPath } from "~/analyses/paths";
import { requireActiveLabRole } from "~/permissions/permissions.server";

/** /analyses → the analyses of the lab the user is working in. */
export async function loader({ request }: Route.LoaderArgs) {
  const access = await requireActiveLabRole(request, "viewer");
  throw redirect(analysesPath(access.lab.slug));
}
