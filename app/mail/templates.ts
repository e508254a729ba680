import type { LabRole } from "~/db/schema";
import type { MailMessage } from "./mailer.server";
import { formatDay } from "~/shared/dates";

const escapeHtml = (s: string) =>
  s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);

/**
 * The sign-in message. Identical for known and unknown addresses, so the mail itself never
 * tells anyone whether an account exists.
 */
export function signInCodeMail(args: { to: string; code: string; magicLink: string; minutes: number }): MailMessage {
  const { to, code, magicLink, minutes } = args;
  return {
    to,
    subject: `Your Stillpoint sign-in code: ${code}`,
    text:
      `Your sign-in code is ${code}\n\n` +
      `Or open this link in the same browser:\n${magicLink}\n\n` +
      `The code works once and expires in ${minutes} minutes.\n` +
      `If you did not ask to sign in, ignore this message.\n`,
    html:
      `<p>Your sign-in code is <strong style="font-size:1.4em;letter-spacing:.1em">${escapeHtml(code)}</strong></p>` +
      `<p>Or <a href="${escapeHtml(magicLink)}">sign in with this link</a> in the same browser.</p>` +
      `<p>The code works once and expires in ${minutes} minutes. If you did not ask to sign in, ignore this message.</p>`,
  };
}

export function invitationMail(args: {
  to: string;
  labName: string;
  role: LabRole;
  inviterName: string;
  acceptUrl: string;
  expiresAt: Date;
}): MailMessage {
  const { to, labName, role, inviterName, acceptUrl, expiresAt } = args;
  const until = formatDay(expiresAt);
  return {
    to,
    subject: `${inviterName} invited you to ${labName} on Stillpoint`,
    text:
      `${inviterName} invited you to join the lab "${labName}" as ${role}.\n\n` +
      `Accept the invitation (sign in with ${to}):\n${acceptUrl}\n\n` +
      `The link works once and expires on ${until}.\n`,
    html:
      `<p>${escapeHtml(inviterName)} invited you to join the lab <strong>${escapeHtml(labName)}</strong> as ${role}.</p>` +
      `<p><a href="${escapeHtml(acceptUrl)}">Accept the invitation</a> (sign in with ${escapeHtml(to)}).</p>` +
      `<p>The link works once and expires on ${until}.</p>`,
  };
}
