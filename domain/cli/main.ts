import { readFileSync } from "node:fs";
import { commands } from "./commands";
import type { CliIO } from "./io";
import { CliError } from "./io";

/** Node-backed I/O; `-` reads standard input. */
export const processIO: CliIO = {
  readFile: (path) => readFileSync(path === "-" ? 0 : path, "utf8"),
  stdout: (text) => void process.stdout.write(text),
  stderr: (text) => void process.stderr.write(text),
};

/** Dispatches `SUBCOMMAND ...args` to its handler; every error goes to stderr with exit code 2. */
export async function main(argv: readonly string[], io: CliIO = processIO): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === "--help" || name === "-h" || name === "help") {
    const summaries = await Promise.all(Object.values(commands).map((load) => load().then((m) => m.summary)));
    const usage = `usage: npm run -s cli -- <command> ...\n${summaries.map((s) => `  ${s}`).join("\n")}\n`;
    if (name === undefined) {
      io.stderr(usage);
      return 2;
    }
    io.stdout(usage);
    return 0;
  }
  const load = commands[name];
  if (!load) {
    io.stderr(`error: unknown command '${name}' (known: ${Object.keys(commands).join(", ")})\n`);
    return 2;
  }
  try {
    const module = await load();
    return await module.run(rest, io);
  } catch (e) {
    const message = e instanceof CliError ? e.message : e instanceof Error ? `${e.name}: ${e.message}` : String(e);
    io.stderr(`error: ${message}\n`);
    return 2;
  }
}

const isEntry = process.argv[1] !== undefined && /domain[\\/]cli[\\/]main\.ts$/.test(process.argv[1]);
if (isEntry) {
  main(process.argv.slice(2)).then((code) => {
    process.exitCode = code;
  });
}
