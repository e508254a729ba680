/**
 * remix-auth-totp keeps the pending sign-in in its own `_totp` cookie (URL-encoded: email, the
 * encrypted code data, the last error). The pages read the address and message from it.
 */
export const TOTP_COOKIE = "_totp";

export function readTotpCookie(request: Request): { email?: string; error?: string } {
  const header = request.headers.get("cookie") ?? "";
  for (const part of header.split(";")) {
    const [rawName, ...rest] = part.split("=");
    if (rawName?.trim() !== TOTP_COOKIE) continue;
    let value = rest.join("=").trim();
    if (value.startsWith('"') && value.endsWith('"')) value = value.slice(1, -1).replace(/\\(.)/g, "$1");
    const params = new URLSearchParams(value);
    return { email: params.get("email") || undefined, error: params.get("error") || undefined };
  }
  return {};
}

/** A Set-Cookie that clears the pending sign-in (e.g. after our own checks refuse a code). */
export function clearTotpCookie(secure: boolean): string {
  return `${TOTP_COOKIE}=; Path=/; Max-Age=0; HttpOnly; SameSite=Lax${secure ? "; Secure" : ""}`;
}
