/**
 * The one date format for people: "2026-12-02 14:05 UTC" (minutes) or "2026-12-02" (a day).
 * Always in UTC and saying so, so that a page rendered on the server and hydrated in a browser
 * in another time zone shows the same text, and two people in two labs read the same time.
 */
const MINUTES = new Intl.DateTimeFormat("en-GB", {
  timeZone: "UTC",
  year: "numeric",
  month: "2-digit",
  day: "2-digit",
  hour: "2-digit",
  minute: "2-digit",
  hourCycle: "h23",
});

type When = Date | string | null | undefined;

function parts(value: Date | string): Record<"year" | "month" | "day" | "hour" | "minute", string> {
  const date = typeof value === "string" ? new Date(value) : value;
  const out: Record<string, string> = {};
  // Assembled from parts: the order and punctuation of a locale's own pattern are not ours to rely on.
  for (const p of MINUTES.formatToParts(date)) out[p.type] = p.value;
  return out as Record<"year" | "month" | "day" | "hour" | "minute", string>;
}

/** "2026-12-02 14:05 UTC"; "—" for no date. */
export function formatDateTime(value: When): string {
  if (!value) return "—";
  const p = parts(value);
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute} UTC`;
}

/** "2026-12-02" (the UTC day); "—" for no date. */
export function formatDay(value: When): string {
  if (!value) return "—";
  const p = parts(value);
  return `${p.year}-${p.month}-${p.day}`;
}
