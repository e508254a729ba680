import { activeLabOf, getIdentity } from "./permissions/permissions.server";

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
  // Accounts (issue 5): the session user and the lab they are working in, read with the session.
  const { user, labs, session } = await getIdentity(request);
  if (!user) return null;
  const lab = activeLabOf(labs, session.labSlug);
  return {
    displayName: user.displayName,
    email: user.email,
    isSiteAdmin: user.isSiteAdmin,
    activeLab: lab ? { slug: lab.slug, name: lab.name } : null,
  };
}
