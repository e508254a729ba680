/**
 * The engine version every result is pinned to: the package version plus a date stamp for the
 * engine's output format. Bump ENGINE_FORMAT when the JSON a job stores changes shape.
 */
import pkg from "../../package.json";

const ENGINE_FORMAT = "2026-12-01";
export const ENGINE_VERSION = `${pkg.version}+${ENGINE_FORMAT}`;
