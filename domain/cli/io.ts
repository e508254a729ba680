/** The CLI's only window on the outside world, so handlers can be tested without a process. */
export interface CliIO {
  readFile(path: string): string;
  stdout(text: string): void;
  stderr(text: string): void;
}

/** A usage or input problem reported to the user (exit code 2). */
export class CliError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "CliError";
  }
}

/** Signature every subcommand implements: returns the process exit code. */
export type CommandHandler = (args: readonly string[], io: CliIO) => number | Promise<number>;

export interface CommandModule {
  readonly run: CommandHandler;
  /** One line for `--help`. */
  readonly summary: string;
}

/** Splits `FILE --flag value --flag=value` into positionals and flags; unknown flags are errors. */
export function parseArgs(args: readonly string[], known: readonly string[]): { positionals: string[]; flags: Map<string, string> } {
  const positionals: string[] = [];
  const flags = new Map<string, string>();
  for (let i = 0; i < args.length; i++) {
    const a = args[i];
    if (a.startsWith("--")) {
      const eq = a.indexOf("=");
      const name = eq >= 0 ? a.slice(2, eq) : a.slice(2);
      if (!known.includes(name)) throw new CliError(`unknown option --${name} (known: ${known.map((k) => `--${k}`).join(", ") || "none"})`);
      const value = eq >= 0 ? a.slice(eq + 1) : args[++i];
      if (value === undefined) throw new CliError(`option --${name} needs a value`);
      flags.set(name, value);
    } else positionals.push(a);
  }
  return { positionals, flags };
}

export function readInput(io: CliIO, path: string): string {
  try {
    return io.readFile(path);
  } catch (e) {
    throw new CliError(`cannot read ${path}: ${(e as NodeJS.ErrnoException).code ?? (e as Error).message}`);
  }
}
