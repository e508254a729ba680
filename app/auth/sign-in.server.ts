import { redirect } from "react-router";
import { db } from "~/db.server";
import { recordAudit } from "~/shared/audit.server";
import { authenticator, CODE_GONE, issuedCode, SIGN_IN_PATHS } from "./authenticator.server";
import { readTicket, ticketCookie } from "./code-ticket.server";
import { checkCodeRequest, checkTypedCode, isOpenLink, looksLikeEmail, normalizeCode, normalizeEmail } from "./login-codes.server";
import { commitSession, destroySession, getSession, rotateSession, safeReturnTo } from "./session.server";
import { readTotpCookie } from "./totp-cookie.server";
import { createUser, parseDisplayName } from "./users.server";

/**
 * The sign-in steps behind the routes. Each either throws the response to send (a redirect with
 * cookies) or returns a refusal for the form to show. Every refusal reads the same whether or
 * not the address has an account.
 */
export interface Refusal {
  status: number;
  error: string;
}

/** Replays the form to the strategy with normalised fields (lower-case address, upper-case code). */
function withForm(request: Request, fields: Record<string, string>): Request {
  const headers = new Headers(request.headers);
  headers.set("Content-Type", "application/x-www-form-urlencoded");
  headers.delete("Content-Length");
  return new Request(request.url, { method: "POST", headers, body: new URLSearchParams(fields).toString() });
}

/** Lets the strategy run and adds our session cookie (and the ticket of a code it issued) to whatever it throws. */
async function runStrategy(request: Request, extraCookie?: string, client = "direct"): Promise<never> {
  const issued: { codeId?: string; client: string } = { client };
  try {
    await issuedCode.run(issued, () => authenticator().authenticate("totp", request));
  } catch (thrown) {
    if (thrown instanceof Response) {
      if (extraCookie) thrown.headers.append("Set-Cookie", extraCookie);
      if (issued.codeId) thrown.headers.append("Set-Cookie", ticketCookie(issued.codeId));
    }
    throw thrown;
  }
  throw new Error("remix-auth-totp returned instead of redirecting");
}

/** Step 1: e-mail a code and a magic link (rate-limited per address and per client). */
export async function requestSignInCode(request: Request, client: string): Promise<Refusal> {
  const form = await request.formData();
  const email = normalizeEmail(form.get("email"));
  if (!looksLikeEmail(email)) return { status: 400, error: "Please enter a valid e-mail address, like ada@example.org." };
  const verdict = await checkCodeRequest(email, client);
  if (!verdict.allowed) {
    const minutes = Math.ceil(verdict.retryAfterSeconds / 60);
    return { status: 429, error: `Too many sign-in codes were requested. Please wait ${minutes} minute${minutes === 1 ? "" : "s"} and try again.` };
  }
  const session = await getSession(request);
  session.set("returnTo", safeReturnTo(form.get("returnTo")));
  return runStrategy(withForm(request, { email }), await commitSession(session), client);
}

/**
 * Step 2a: the typed code. Wrong guesses are counted on the issued code named by this browser's
 * signed ticket (not on the address in the unsigned `_totp` cookie); the strategy checks the rest.
 */
export async function verifySignInCode(request: Request): Promise<Refusal> {
  const { email } = readTotpCookie(request);
  if (!email) throw redirect(SIGN_IN_PATHS.start);
  const form = await request.formData();
  const code = normalizeCode(form.get("code"));
  if (!code) return { status: 400, error: "Please enter the code from the e-mail." };
  const codeId = readTicket(request);
  if (!codeId) return { status: 400, error: CODE_GONE };
  const check = await checkTypedCode(codeId, email, code);
  if (check.result === "expired") return { status: 400, error: CODE_GONE };
  if (check.result === "locked") return { status: 429, error: "Too many wrong codes. Please request a new one." };
  if (check.result === "wrong") {
    const left = check.attemptsLeft;
    return { status: 400, error: `That code is not right. ${left} attempt${left === 1 ? "" : "s"} left.` };
  }
  return runStrategy(withForm(request, { code }));
}

/** Step 2b: the magic link, valid once, in the browser that asked for it. */
export async function followMagicLink(request: Request): Promise<never> {
  const token = new URL(request.url).searchParams.get("t");
  if (!token || !(await isOpenLink(token))) throw redirect(`${SIGN_IN_PATHS.start}?link=expired`);
  return runStrategy(request);
}

/** Step 3 (first sign-in only): the display name creates the account. */
export async function completeAccount(request: Request): Promise<Refusal> {
  const session = await getSession(request);
  const email = session.get("pendingEmail");
  if (!email) throw redirect(SIGN_IN_PATHS.start);
  const form = await request.formData();
  const name = parseDisplayName(form.get("displayName"));
  if (!name.ok) return { status: 400, error: name.message };
  const { user, created } = await createUser(db(), email, name.value);
  if (created) await recordAudit(db(), { kind: "auth.account_created", actorId: user.id, details: {} });
  await recordAudit(db(), { kind: "auth.signed_in", actorId: user.id, details: { method: "code", first: created } });
  const cookie = await rotateSession(session, { userId: user.id });
  throw redirect(safeReturnTo(session.get("returnTo")), { headers: { "Set-Cookie": cookie } });
}

/** Ends this browser's session, server-side too. */
export async function signOut(request: Request): Promise<never> {
  const session = await getSession(request);
  throw redirect("/", { headers: { "Set-Cookie": await destroySession(session) } });
}
