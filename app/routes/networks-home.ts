import { redirect } from "react-router";
import type { Route } from "./+types/networks-home";
import { requireActiveLabRole } from "~/permissions/permissions.server";

/** /networks → the working lab's network list. */
export async function loader({ request }: Route.LoaderArgs) {
  const access = await requireActiveLabRole(request, "viewer");
  throw redirect(`/labs/${access.lab.slug}/networks`);
}
