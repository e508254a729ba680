import { AsyncLocalStorage } from "node:async_hooks";
import { redirect } from "react-router";
import { Authenticator } from "remix-auth";
import { TOTPStrategy } from "remix-auth-totp";
import { db } from "~/db.server";
import { getEnv } from "~/env.server";
import { sendMail } from "~/mail/mailer.server";
import { signInCodeMail } from "~/mail/templates";
import { recordAudit } from "~/shared/audit.server";
import { CODE_CHARSET, consumeCode, recordIssuedCode, SIGN_IN_POLICY } from "./login-codes.server";
import { getSession, rotateSession, safeReturnTo } from "./session.server";
import { findUserByEmail } from "./users.server";

export const SIGN_IN_PATHS = {
  start: "/sign-in",
  verify: "/sign-in/verify",
  magicLink: "/sign-in/magic",
  welcome: "/welcome",
} as const;

/**
 * The ledger row of the code issued while handling one request, read back by the sign-in step
 * for the browser's ticket, and the rate-limit key of the client asking (from the load context,
 * app/auth/client-key.server.ts). remix-auth copies the Request, so the request object cannot be the key.
 */
export const issuedCode = new AsyncLocalStorage<{ codeId?: string; client: string }>();

/** Thrown inside `verify` when our ledger refuses; the strategy turns it into its error cookie. */
export const CODE_GONE = "That code has expired or was already used. Please request a new one.";

/**
 * remix-auth with the TOTP strategy. The strategy generates the code, mails it with a magic link,
 * and checks it against its encrypted cookie; our ledger (login-codes.server.ts) adds single use,
 * attempt and rate limits. `verify` never returns: it starts a fresh server-side session and
 * throws the redirect, because remix-auth 4 leaves session handling to the app.
 */
function createAuthenticator() {
  const env = getEnv();
  const authenticator = new Authenticator<never>();
  const strategy = new TOTPStrategy<never>(
    {
      secret: env.totpSecret,
      magicLinkPath: SIGN_IN_PATHS.magicLink,
      emailSentRedirect: SIGN_IN_PATHS.verify,
      successRedirect: "/labs",
      failureRedirect: SIGN_IN_PATHS.verify,
      totpGeneration: {
        period: SIGN_IN_POLICY.codeMinutes * 60,
        digits: 6,
        charSet: CODE_CHARSET,
        maxAttempts: SIGN_IN_POLICY.maxWrongAttempts,
      },
      // Outlive the code a little so a late attempt gets "expired", not "start again".
      cookieOptions: { maxAge: (SIGN_IN_POLICY.codeMinutes + 5) * 60, ...(env.secureCookies ? { secure: true } : {}) },
      async sendTOTP({ email, code, magicLink, request }) {
        // The strategy builds the link from the request origin; behind a proxy that is internal.
        const link = new URL(magicLink);
        const publicLink = new URL(link.pathname + link.search, env.appUrl).toString();
        const codeId = await recordIssuedCode({ email, code, linkToken: link.searchParams.get("t") ?? "", client: issuedCode.getStore()?.client ?? "direct" });
        const holder = issuedCode.getStore();
        if (holder) holder.codeId = codeId;
        try {
          await sendMail(signInCodeMail({ to: email, code, magicLink: publicLink, minutes: SIGN_IN_POLICY.codeMinutes }));
        } catch (err) {
          console.error("[mail] sign-in code not sent:", err instanceof Error ? err.message : err);
          throw new Error("We could not send the e-mail just now. Please try again in a minute.");
        }
      },
    },
    async ({ email, formData, request }) => {
      const proof =
        request.method === "GET"
          ? { linkToken: new URL(request.url).searchParams.get("t") ?? "" }
          : { code: String(formData?.get("code") ?? "") };
      if (!(await consumeCode(email, proof))) throw new Error(CODE_GONE);

      const session = await getSession(request);
      const returnTo = safeReturnTo(session.get("returnTo"));
      const user = await findUserByEmail(db(), email);
      if (!user) {
        // First sign-in: the address is proven; the account is created once we have a name.
        const cookie = await rotateSession(session, { pendingEmail: email, returnTo });
        throw redirect(SIGN_IN_PATHS.welcome, { headers: { "Set-Cookie": cookie } });
      }
      await recordAudit(db(), { kind: "auth.signed_in", actorId: user.id, details: { method: request.method === "GET" ? "magic_link" : "code" } });
      const cookie = await rotateSession(session, { userId: user.id });
      throw redirect(returnTo, { headers: { "Set-Cookie": cookie } });
    },
  );
  authenticator.use(strategy, "totp");
  return authenticator;
}

let instance: Authenticator<never> | undefined;

export function authenticator(): Authenticator<never> {
  instance ??= createAuthenticator();
  return instance;
}
