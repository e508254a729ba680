import type { CommandModule } from "./io";

/**
 * Subcommand registry: name -> lazily loaded handler module (each module exports `command`).
 * To add a subcommand, add one line here, e.g.
 *   analyse: () => import("./analyse").then((m) => m.command),
  convert: () => import("./convert").then((m) => m.command),
  scan: () => import("./scan").then((m) => m.command),
  multistationarity: () => import("./multistationarity").then((m) => m.command),
 */
export const commands: Record<string, () => Promise<CommandModule>> = {
  groebner: () => import("./groebner").then((m) => m.command),
  divide: () => import("./divide").then((m) => m.command),
  analyse: () => import("./analyse").then((m) => m.command),
  convert: () => import("./convert").then((m) => m.command),
  scan: () => import("./scan").then((m) => m.command),
  multistationarity: () => import("./multistationarity").then((m) => m.command),
};
