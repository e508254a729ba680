import type { DbExecutor, User } from "~/db/schema";

/** What the app passes around for the signed-in person. */
export interface CurrentUser {
  id: string;
  email: string;
  displayName: string;
  isSiteAdmin: boolean;
}

export function toCurrentUser(row: Pick<User, "id" | "email" | "display_name" | "is_site_admin">): CurrentUser {
  return { id: row.id, email: row.email, displayName: row.display_name, isSiteAdmin: row.is_site_admin };
}

const columns = ["id", "email", "display_name", "is_site_admin"] as const;

export async function findUserById(db: DbExecutor, id: string): Promise<CurrentUser | undefined> {
  const row = await db.selectFrom("users").select(columns).where("id", "=", id).executeTakeFirst();
  return row && toCurrentUser(row);
}

export async function findUserByEmail(db: DbExecutor, email: string): Promise<CurrentUser | undefined> {
  const row = await db.selectFrom("users").select(columns).where("email", "=", email.toLowerCase()).executeTakeFirst();
  return row && toCurrentUser(row);
}

/** Creates the account, or returns the existing one if two first sign-ins raced. */
export async function createUser(db: DbExecutor, email: string, displayName: string): Promise<{ user: CurrentUser; created: boolean }> {
  const inserted = await db
    .insertInto("users")
    .values({ email: email.toLowerCase(), display_name: displayName })
    .onConflict((oc) => oc.column("email").doNothing())
    .returning(columns)
    .executeTakeFirst();
  if (inserted) return { user: toCurrentUser(inserted), created: true };
  const existing = await findUserByEmail(db, email);
  if (!existing) throw new Error("user vanished while being created");
  return { user: existing, created: false };
}

export async function updateDisplayName(db: DbExecutor, userId: string, displayName: string): Promise<void> {
  await db.updateTable("users").set({ display_name: displayName }).where("id", "=", userId).execute();
}

/** Trimmed, 1–100 characters, no control characters; returns an error message or the clean name. */
export function parseDisplayName(raw: unknown): { ok: true; value: string } | { ok: false; message: string } {
  const value = typeof raw === "string" ? raw.trim().replace(/\s+/g, " ") : "";
  if (value.length === 0) return { ok: false, message: "Please enter the name your colleagues know you by." };
  if (value.length > 100) return { ok: false, message: "Please keep the name under 100 characters." };
  if (/[\u0000-\u001f\u007f]/.test(value)) return { ok: false, message: "The name contains control characters." };
  return { ok: true, value };
}
