import { redirect } from "react-router";
import { db } from "~/db.server";
import { destroyAllSessionsOf } from "~/auth/session.server";
import { parseDisplayName, updateDisplayName, type CurrentUser } from "~/auth/users.server";
import { recordAudit } from "~/shared/audit.server";
import { type ActionResult, field, ok, refuse } from "~/shared/form";
import { isUuid } from "~/shared/uuid";
import { createApiToken, parseExpiryDays, parseTokenName, revokeApiToken } from "./api-tokens.server";

export const ACCOUNT_INTENTS = ["rename", "create-token", "revoke-token", "sign-out-everywhere"] as const;
export type AccountIntent = (typeof ACCOUNT_INTENTS)[number];

export function parseAccountIntent(form: FormData): AccountIntent | undefined {
  const intent = field(form, "intent");
  return (ACCOUNT_INTENTS as readonly string[]).includes(intent) ? (intent as AccountIntent) : undefined;
}

/** Changes to one's own account; every intent acts on `user` only. */
export async function runAccountIntent(user: CurrentUser, intent: AccountIntent, form: FormData): Promise<ActionResult> {
  switch (intent) {
    case "rename": {
      const name = parseDisplayName(field(form, "displayName"));
      if (!name.ok) return refuse(400, name.message);
      await updateDisplayName(db(), user.id, name.value);
      return ok("Name saved.");
    }
    case "create-token": {
      const name = parseTokenName(field(form, "name"));
      if (!name.ok) return refuse(400, name.message);
      const expiry = parseExpiryDays(field(form, "expiresInDays"));
      if (!expiry.ok) return refuse(400, expiry.message);
      const { token } = await createApiToken(db(), { userId: user.id, name: name.value, expiresAt: expiry.value });
      return ok(`Token “${name.value}” created. Copy it now: it is shown only once.`, { secret: token });
    }
    case "revoke-token": {
      const tokenId = field(form, "tokenId");
      if (!isUuid(tokenId) || !(await revokeApiToken(db(), user.id, tokenId))) return refuse(404, "No such active token.");
      return ok("Token revoked; it stops working immediately.");
    }
    case "sign-out-everywhere": {
      const ended = await destroyAllSessionsOf(user.id);
      await recordAudit(db(), { kind: "auth.signed_out_everywhere", actorId: user.id, details: { sessions: ended } });
      // This browser's row is gone too; the stale cookie now reads as signed out.
      throw redirect("/sign-in");
    }
  }
}
