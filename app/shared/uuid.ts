const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * True for a UUID in its text form. Ids from URLs and forms are checked with this before a
 * query, so a malformed id is "not found" rather than a PostgreSQL cast error.
 */
export const isUuid = (value: string | null | undefined): value is string => typeof value === "string" && UUID.test(value);
