import { redirect } from "react-router";
import { db } from "~/db.server";
import type { LabRole } from "~/db/schema";
import { readIdentity, type Identity, type MemberLab } from "~/auth/identity.server";
import { findUserById, type CurrentUser } from "~/auth/users.server";
import { findUserIdByApiToken } from "~/account/api-tokens.server";
import { findLabWithRole } from "~/labs/labs.server";
import { apiError } from "./api-errors";
import { assertCookieWriteAllowed } from "./api-origin.server";
import { hasRole } from "./roles";
import { notFound } from "~/shared/responses";

/**
 * The one place that decides who may do what. Every loader, action and API route calls one of
 * the `require*` functions first; they either return who is asking or throw the response to send:
 *
 *   page routes:  not signed in → 302 to /sign-in?returnTo=…; not a member → 404; too low a role → 403
 *   API routes:   no or bad credentials → 401 JSON; not a member → 404 JSON; too low a role → 403 JSON
 *
 * A lab the caller does not belong to answers exactly like a lab that does not exist, so slugs
 * cannot be probed. Site administrators get the admin lists, not other labs' contents.
 *
 * A public lab (the worked examples) is the one exception: every signed-in person reads it as a
 * viewer without being a member — a guest. Guests get nothing beyond the viewer role, and
 * `requireLabMember` keeps them out of the member list (people's addresses are for members only).
 */

export interface LabAccess {
  user: CurrentUser;
  lab: { id: string; slug: string; name: string; isPublic: boolean };
  role: LabRole;
  /** Reading a public lab without being a member of it. */
  guest: boolean;
}

/**
 * Who asked (session, user and their labs: one query, identity.server.ts), looked up once per read
 * request: a page view runs the root loader and the route's loader on the same Request, and each
 * asks. Writes always look again (a sign-out earlier in the same request must count).
 */
const identitiesOfReads = new WeakMap<Request, Promise<Identity>>();

export function getIdentity(request: Request): Promise<Identity> {
  if (request.method !== "GET" && request.method !== "HEAD") return readIdentity(db(), request);
  let identity = identitiesOfReads.get(request);
  if (!identity) {
    identity = readIdentity(db(), request);
    identitiesOfReads.set(request, identity);
  }
  return identity;
}

/** The signed-in user from the session cookie, or null. Never throws for anonymous visitors. */
export async function getOptionalUser(request: Request): Promise<CurrentUser | null> {
  return (await getIdentity(request)).user;
}

function signInRedirect(request: Request): Response {
  const url = new URL(request.url);
  // After a refused POST, come back to the page rather than replaying the form.
  const returnTo = url.pathname + (request.method === "GET" ? url.search : "");
  return redirect(`/sign-in?returnTo=${encodeURIComponent(returnTo)}`);
}

const forbidden = (message: string) => new Response(message, { status: 403, statusText: "Forbidden" });

export async function requireUser(request: Request): Promise<CurrentUser> {
  const user = await getOptionalUser(request);
  if (!user) throw signInRedirect(request);
  return user;
}

export async function requireSiteAdmin(request: Request): Promise<CurrentUser> {
  const user = await requireUser(request);
  if (!user.isSiteAdmin) throw forbidden("Only site administrators can see this page.");
  return user;
}

/**
 * `memberOf`: the caller's labs when already read with the session (identity.server.ts); a lab
 * among them needs no further query. Any other slug (a public lab, someone else's, none at all)
 * is looked up.
 */
async function labAccess(user: CurrentUser, labSlug: string | undefined, minRole: LabRole, memberOf: readonly MemberLab[] = []) {
  const member = labSlug ? memberOf.find((l) => l.slug === labSlug) : undefined;
  const row = member
    ? { id: member.id, slug: member.slug, name: member.name, is_public: member.isPublic, role: member.role }
    : labSlug
      ? await findLabWithRole(db(), labSlug, user.id)
      : undefined;
  const role: LabRole | null = row?.role ?? (row?.is_public ? "viewer" : null);
  if (!row || !role) return { outcome: "not_found" as const };
  if (!hasRole(role, minRole)) return { outcome: "forbidden" as const, role };
  const access: LabAccess = { user, lab: { id: row.id, slug: row.slug, name: row.name, isPublic: row.is_public }, role, guest: !row.role };
  return { outcome: "ok" as const, access };
}

export async function requireLabRole(request: Request, labSlug: string | undefined, minRole: LabRole): Promise<LabAccess> {
  const { user, labs } = await getIdentity(request);
  if (!user) throw signInRedirect(request);
  const result = await labAccess(user, labSlug, minRole, labs);
  if (result.outcome === "not_found") throw notFound();
  if (result.outcome === "forbidden") throw forbidden(`This needs the ${minRole} role; you are ${article(result.role)} ${result.role} here.`);
  return result.access;
}

/**
 * The caller of a JSON API route: `Authorization: Bearer <personal token>` if the header is
 * present (a bad token is refused, never silently replaced by the cookie), else the session cookie
 * — and then a write must be same-origin JSON (api-origin.server.ts), so other sites cannot
 * make the browser write with it.
 */
export async function requireApiUser(request: Request): Promise<CurrentUser> {
  return (await apiCaller(request)).user;
}

/** The API caller and, for a session cookie, the labs read with it (a token's labs are looked up per lab). */
async function apiCaller(request: Request): Promise<{ user: CurrentUser; labs: readonly MemberLab[] }> {
  const header = request.headers.get("authorization");
  if (header !== null) {
    const match = /^Bearer\s+(\S+)\s*$/i.exec(header);
    const userId = match ? await findUserIdByApiToken(db(), match[1]!) : undefined;
    const user = userId ? await findUserById(db(), userId) : undefined;
    if (!user) throw apiError("invalid_token", "The API token is missing, malformed, expired or revoked.");
    return { user, labs: [] };
  }
  const { user, labs } = await getIdentity(request);
  if (!user) throw apiError("unauthenticated", "Sign in or send a personal API token as `Authorization: Bearer <token>`.");
  assertCookieWriteAllowed(request);
  return { user, labs };
}

export async function requireApiLabRole(request: Request, labSlug: string | undefined, minRole: LabRole): Promise<LabAccess> {
  const { user, labs } = await apiCaller(request);
  const result = await labAccess(user, labSlug, minRole, labs);
  if (result.outcome === "not_found") throw apiError("not_found", "No such lab.");
  if (result.outcome === "forbidden") {
    throw apiError("forbidden", `This needs the ${minRole} role in the lab.`, { role: result.role, required: minRole });
  }
  return result.access;
}

export async function requireApiSiteAdmin(request: Request): Promise<CurrentUser> {
  const user = await requireApiUser(request);
  if (!user.isSiteAdmin) throw apiError("forbidden", "Only site administrators can do this.");
  return user;
}

/**
 * For what only members see (who the other members are): a guest of a public lab is answered as
 * if the page did not exist, like any other lab they are not in.
 */
export function requireLabMember(access: LabAccess, api = false): LabAccess {
  if (!access.guest) return access;
  if (api) throw apiError("not_found", "No such lab.");
  throw notFound();
}

const article = (role: LabRole) => (role === "viewer" ? "a" : "an");

/**
 * For routes whose actions need different roles per intent: after `requireLabRole(…, "viewer")`
 * and parsing the intent, refuse (403) when the caller's role is too low.
 */
export function assertLabRole(access: LabAccess, minRole: LabRole, api = false): void {
  if (hasRole(access.role, minRole)) return;
  if (api) throw apiError("forbidden", `This needs the ${minRole} role in the lab.`, { role: access.role, required: minRole });
  throw forbidden(`This needs the ${minRole} role; you are ${article(access.role)} ${access.role} here.`);
}

/**
 * The lab the user is working in (the one they last switched to, else their first) with at least
 * `minRole`; for pages without a lab in the URL. No lab at all → redirect to /labs to create one.
 */
export async function requireActiveLabRole(request: Request, minRole: LabRole): Promise<LabAccess> {
  const { user, labs, session } = await getIdentity(request);
  if (!user) throw signInRedirect(request);
  const lab = activeLabOf(labs, session.labSlug);
  if (!lab) throw redirect("/labs");
  if (!hasRole(lab.role, minRole)) throw forbidden(`This needs the ${minRole} role; you are ${article(lab.role)} ${lab.role} in ${lab.name}.`);
  return { user, lab: { id: lab.id, slug: lab.slug, name: lab.name, isPublic: lab.isPublic }, role: lab.role, guest: false };
}

/** The lab the user last switched to (`preferred`, the session's labSlug) if still theirs, else their first. */
export function activeLabOf(labs: readonly MemberLab[], preferred: string | undefined): MemberLab | undefined {
  return labs.find((l) => l.slug === preferred) ?? labs[0];
}
