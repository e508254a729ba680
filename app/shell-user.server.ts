import { db } from "./db.server";
import { getSession } from "./auth/session.server";
import { listLabsOf } from "./labs/labs.server";
import { getOptionalUser } from "./permissions/permissions.server";

/**
 * The signed-in user shown in the app shell (header), or null when signed out.
 * The accounts module plugs its session lookup in here; the shell needs nothing else.
 */
export interface ShellUser {
  displayName: string;
  email: string;
  isSiteAdmin: boolean;
  /** The lab the user last switched to (else their first), shown in the header. */
  activeLab?: { slug: string; name: string } | null;
}

export async function getShellUser(request: Request): Promise<ShellUser | null> {
  // Accounts (issue 5): the session user and the lab they are working in.
  const user = await getOptionalUser(request);
  if (!user) return null;
  const labs = await listLabsOf(db(), user.id);
  const preferred = (await getSession(request)).get("labSlug");
  const lab = labs.find((l) => l.slug === preferred) ?? labs[0];
  return {
    displayName: user.displayName,
    email: user.email,
    isSiteAdmin: user.isSiteAdmin,
    activeLab: lab ? { slug: lab.slug, name: lab.name } : null,
  };
}
