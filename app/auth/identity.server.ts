/**
 * Who is asking, in one query: the session row the cookie names (live: not deleted by a sign-out,
 * not expired), the user it belongs to, and the labs that user is a member of with their role.
 * A page view needs all three (the header shows the user and the active lab, the route checks the
 * lab role); asking them one by one cost four round trips to the database per request, and under
 * load those round trips were the largest part of a request's CPU time (bench/load.ts).
 *
 * The decisions stay where they were (permissions.server.ts); this only reads. A session whose
 * row is gone answers "nobody", exactly like the session storage's own read.
 */
import { sql } from "kysely";
import type { DbExecutor, LabRole } from "~/db/schema";
import type { SessionData } from "./session.server";
import { sessionIdOf, sessionKey } from "./session.server";
import { toCurrentUser, type CurrentUser } from "./users.server";

/** A lab the user belongs to, with their role in it. */
export interface MemberLab {
  id: string;
  slug: string;
  name: string;
  isPublic: boolean;
  role: LabRole;
}

export interface Identity {
  /** The live session's data (empty for a visitor without a session). */
  session: SessionData;
  user: CurrentUser | null;
  /** The user's labs, alphabetically by name (empty when signed out). */
  labs: MemberLab[];
}

const NOBODY: Identity = Object.freeze({ session: {}, user: null, labs: [] }) as Identity;

/**
 *   readIdentity(db, request)   // { session: { userId, labSlug }, user: { id, … }, labs: [{ slug, role, … }] }
 *   readIdentity(db, anonymous) // { session: {}, user: null, labs: [] }
 */
export async function readIdentity(db: DbExecutor, request: Request): Promise<Identity> {
  const id = await sessionIdOf(request);
  if (!id) return NOBODY;
  const row = await db
    .selectFrom("sessions as s")
    .leftJoin("users as u", "u.id", "s.user_id")
    .select([
      "s.data",
      "u.id",
      "u.email",
      "u.display_name",
      "u.is_site_admin",
      // The labs as one JSON array, so the whole answer is one round trip.
      sql<MemberLab[] | null>`(
        SELECT json_agg(json_build_object('id', l.id, 'slug', l.slug, 'name', l.name, 'isPublic', l.is_public, 'role', m.role) ORDER BY l.name, l.id)
        FROM memberships m JOIN labs l ON l.id = m.lab_id
        WHERE m.user_id = u.id
      )`.as("labs"),
    ])
    .where("s.id_hash", "=", sessionKey(id))
    .where("s.expires_at", ">", new Date())
    .executeTakeFirst();
  if (!row) return NOBODY;
  const session = (row.data ?? {}) as SessionData;
  // The row's user column mirrors the data's userId (session.server.ts writes both together);
  // both must agree for the request to count as that user.
  const signedIn = row.id !== null && typeof session.userId === "string" && session.userId === row.id;
  if (!signedIn) return { session, user: null, labs: [] };
  const user = toCurrentUser({ id: row.id!, email: row.email!, display_name: row.display_name!, is_site_admin: row.is_site_admin! });
  return { session, user, labs: row.labs ?? [] };
}
