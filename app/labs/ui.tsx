import type { ReactNode } from "react";
import { Form } from "react-router";
import type { LabRole } from "~/db/schema";

/** The outcome line under a form: an error (role=alert) or a quiet confirmation. */
export function FormMessage({ result }: { result?: { error?: string; notice?: string } | null }) {
  if (result?.error) {
    return (
      <p role="alert" className="rounded-md bg-danger-soft px-3 py-2 text-sm text-danger">
        {result.error}
      </p>
    );
  }
  if (result?.notice) {
    return (
      <p role="status" className="rounded-md bg-ok-soft px-3 py-2 text-sm text-ok">
        {result.notice}
      </p>
    );
  }
  return null;
}

export function RoleBadge({ role }: { role: LabRole }) {
  const tone = role === "owner" ? "bg-accent-soft text-accent-strong" : role === "editor" ? "bg-signal-soft text-signal" : "bg-sunken text-muted";
  return <span className={`rounded-pill px-2 py-0.5 text-xs font-medium ${tone}`}>{role}</span>;
}

export const inputClass =
  "w-full rounded-md border border-line bg-surface px-3 py-2 text-sm text-ink placeholder:text-faint focus:border-accent focus:outline-none";
export const labelClass = "block text-sm font-medium text-ink";

/**
 * A one-button form posting `intent` and a few hidden fields to the current route's action —
 * the small row actions (revoke, remove, resend) of the account and member pages.
 */
export function IntentButton({ intent, fields = {}, tone = "accent", children }: {
  intent: string;
  fields?: Record<string, string>;
  tone?: "accent" | "danger";
  children: ReactNode;
}) {
  return (
    <Form method="post">
      <input type="hidden" name="intent" value={intent} />
      {Object.entries(fields).map(([name, value]) => <input key={name} type="hidden" name={name} value={value} />)}
      <button type="submit" className={`text-xs hover:underline ${tone === "danger" ? "text-danger" : "text-accent"}`}>{children}</button>
    </Form>
  );
}
