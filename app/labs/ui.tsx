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

export function formatDate(value: Date | string | null | undefined): string {
  if (!value) return "—";
  const d = typeof value === "string" ? new Date(value) : value;
  return d.toISOString().slice(0, 16).replace("T", " ") + " UTC";
}
