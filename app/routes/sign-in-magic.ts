import type { Route } from "./+types/sign-in-magic";
import { followMagicLink } from "~/auth/sign-in.server";

/**
 * GET /sign-in/magic?t=… — the link in the sign-in e-mail. Public by nature: the link itself (plus
 * the browser's pending-sign-in cookie) is the credential, checked and spent in followMagicLink.
 */
export async function loader({ request }: Route.LoaderArgs) {
  return followMagicLink(request);
}
