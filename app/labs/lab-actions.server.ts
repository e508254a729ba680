import { db } from "~/db.server";
import { getEnv } from "~/env.server";
import { looksLikeEmail, normalizeEmail } from "~/auth/login-codes.server";
import { isUuid } from "~/shared/uuid";
import { sendMail } from "~/mail/mailer.server";
import { invitationMail } from "~/mail/templates";
import type { LabAccess } from "~/permissions/permissions.server";
import { isLabRole } from "~/permissions/roles";
import { createInvitation, InvitationError, resendInvitation, revokeInvitation } from "./invitations.server";
import { parseLabName, renameLab } from "./labs.server";
import { changeRole, MembershipError, removeMember } from "./memberships.server";
import { type ActionResult, field, ok, refuse } from "~/shared/form";
import { takeRateLimit } from "~/auth/rate-limit.server";

/**
 * Invitation e-mails go to addresses the sender chooses, so they are rate-limited like sign-in
 * codes (atomically in the database): per invitation (resends) and per lab (all invitation mail).
 */
export const INVITATION_MAIL_POLICY = { windowMinutes: 60, perInvitation: 3, perLab: 30 } as const;

async function takeInvitationMail(labId: string, which: string): Promise<ActionResult | undefined> {
  const { windowMinutes, perInvitation, perLab } = INVITATION_MAIL_POLICY;
  const verdict = await takeRateLimit([
    { bucket: `invite:lab:${labId}`, max: perLab, windowMinutes },
    { bucket: `invite:one:${labId}:${which}`.slice(0, 200), max: perInvitation, windowMinutes },
  ]);
  if (verdict.allowed) return undefined;
  const minutes = Math.ceil(verdict.retryAfterSeconds / 60);
  return refuse(429, `Too many invitation e-mails were sent just now. Please wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`);
}

/** The intents of the members page; all of them need the owner role (checked by the route). */
export const MEMBER_INTENTS = ["invite", "resend", "revoke", "change-role", "remove"] as const;
export type MemberIntent = (typeof MEMBER_INTENTS)[number];

export function parseMemberIntent(form: FormData): MemberIntent | undefined {
  const intent = field(form, "intent");
  return (MEMBER_INTENTS as readonly string[]).includes(intent) ? (intent as MemberIntent) : undefined;
}

async function mailInvitation(access: LabAccess, args: { email: string; role: Parameters<typeof invitationMail>[0]["role"]; token: string; expiresAt: Date }) {
  try {
    await sendMail(
      invitationMail({
        to: args.email,
        labName: access.lab.name,
        role: args.role,
        inviterName: access.user.displayName,
        acceptUrl: `${getEnv().appUrl}/invitations/${args.token}`,
        expiresAt: args.expiresAt,
      }),
    );
    return true;
  } catch (err) {
    console.error("[mail] invitation not sent:", err instanceof Error ? err.message : err);
    return false;
  }
}

/** Runs an owner's change to members or invitations. */
export async function runMemberIntent(access: LabAccess, intent: MemberIntent, form: FormData): Promise<ActionResult> {
  const labId = access.lab.id;
  const actorId = access.user.id;
  try {
    switch (intent) {
      case "invite": {
        const email = normalizeEmail(field(form, "email"));
        const role = field(form, "role");
        if (!looksLikeEmail(email)) return refuse(400, "Please enter a valid e-mail address to invite.");
        if (!isLabRole(role)) return refuse(400, "Choose a role: owner, editor or viewer.");
        const limited = await takeInvitationMail(labId, email);
        if (limited) return limited;
        const inv = await createInvitation(db(), { labId, actorId, email, role });
        const sent = await mailInvitation(access, { email, role, token: inv.token, expiresAt: inv.expiresAt });
        return sent ? ok(`Invitation sent to ${email}.`) : refuse(502, `The invitation to ${email} is saved, but the e-mail could not be sent. Use “Resend”.`);
      }
      case "resend": {
        const invitationId = field(form, "invitationId");
        if (!isUuid(invitationId)) return refuse(400, "No such invitation.");
        const limited = await takeInvitationMail(labId, invitationId);
        if (limited) return limited;
        const inv = await resendInvitation(db(), { labId, actorId, invitationId });
        const sent = await mailInvitation(access, { email: inv.email, role: inv.role, token: inv.token, expiresAt: inv.expiresAt });
        return sent ? ok(`A new link was sent to ${inv.email}.`) : refuse(502, "The e-mail could not be sent just now. Please try again.");
      }
      case "revoke": {
        const invitationId = field(form, "invitationId");
        if (!isUuid(invitationId)) return refuse(400, "No such invitation.");
        await revokeInvitation(db(), { labId, actorId, invitationId });
        return ok("Invitation withdrawn; its link no longer works.");
      }
      case "change-role": {
        const userId = field(form, "userId");
        const role = field(form, "role");
        if (!isUuid(userId)) return refuse(400, "No such member.");
        if (!isLabRole(role)) return refuse(400, "Choose a role: owner, editor or viewer.");
        await changeRole(db(), { labId, actorId, userId, role });
        return ok("Role changed.");
      }
      case "remove": {
        const userId = field(form, "userId");
        if (!isUuid(userId)) return refuse(400, "No such member.");
        await removeMember(db(), { labId, actorId, userId });
        return ok("Member removed.");
      }
    }
  } catch (err) {
    if (err instanceof InvitationError) return refuse(err.code === "already_member" ? 409 : 404, err.message);
    if (err instanceof MembershipError) return refuse(err.code === "last_owner" ? 409 : 404, err.message);
    throw err;
  }
}

export async function runRename(access: LabAccess, form: FormData): Promise<ActionResult> {
  const name = parseLabName(field(form, "name"));
  if (!name.ok) return refuse(400, name.message);
  await renameLab(db(), { labId: access.lab.id, actorId: access.user.id, name: name.value });
  return ok("Lab renamed.");
}

/** Any member may leave, except the last owner. */
export async function runLeave(access: LabAccess): Promise<ActionResult> {
  try {
    await removeMember(db(), { labId: access.lab.id, actorId: access.user.id, userId: access.user.id });
    return ok(`You left ${access.lab.name}.`);
  } catch (err) {
    if (err instanceof MembershipError) return refuse(409, err.message);
    throw err;
  }
}
