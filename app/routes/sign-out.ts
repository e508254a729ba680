import { redirect } from "react-router";
import type { Route } from "./+types/sign-out";
import { signOut } from "~/auth/sign-in.server";

/** POST /sign-out ends this browser's session (server-side row and cookie). GET just goes home. */
export async function action({ request }: Route.ActionArgs) {
  return signOut(request);
}

export function loader() {
  return redirect("/");
}
