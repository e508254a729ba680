import { getEnv } from "~/env.server";
import { hmacHex, sameHex } from "./hashing.server";
import { SIGN_IN_POLICY } from "./login-codes.server";
import { isUuid } from "~/shared/uuid";

/**
 * The browser that asked for a sign-in code gets a ticket naming the issued code (its ledger
 * row), signed with TOTP_SECRET. Wrong guesses are counted against the code the ticket names,
 * never against an address the client supplies: the strategy's own `_totp` cookie is not signed,
 * so anyone can write a victim's address into it, but nobody can mint a ticket for the victim's
 * code without having requested it in that browser.
 *
 *   const cookie = ticketCookie(rowId);        // "stillpoint_code=<id>.<hmac>; Path=/; HttpOnly; ..."
 *   readTicket(request) === rowId              // true for the browser holding it, undefined if forged
 */
export const TICKET_COOKIE = "stillpoint_code";

const sign = (rowId: string) => hmacHex(getEnv().totpSecret, `code-ticket:${rowId}`);

export function ticketCookie(rowId: string): string {
  const maxAge = (SIGN_IN_POLICY.codeMinutes + 5) * 60;
  const secure = getEnv().secureCookies ? "; Secure" : "";
  return `${TICKET_COOKIE}=${rowId}.${sign(rowId)}; Path=/; Max-Age=${maxAge}; HttpOnly; SameSite=Lax${secure}`;
}

export function clearTicketCookie(): string {
  const secure = getEnv().secureCookies ? "; Secure" : "";
  return `${TICKET_COOKIE}=; Path=/; Max-Age=0; HttpOnly; SameSite=Lax${secure}`;
}

/** The ledger row id the request's ticket names, or undefined when absent or not signed by us. */
export function readTicket(request: Request): string | undefined {
  const header = request.headers.get("cookie") ?? "";
  for (const part of header.split(";")) {
    const [rawName, ...rest] = part.split("=");
    if (rawName?.trim() !== TICKET_COOKIE) continue;
    const value = rest.join("=").trim();
    const dot = value.lastIndexOf(".");
    if (dot <= 0) return undefined;
    const rowId = value.slice(0, dot);
    if (!isUuid(rowId)) return undefined;
    return sameHex(value.slice(dot + 1), sign(rowId)) ? rowId : undefined;
  }
  return undefined;
}
