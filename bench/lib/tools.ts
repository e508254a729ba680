/**
 * The three programs the benchmark runs, each as a whole process:
 * - ours: `node scripts/cli.mjs groebner FILE` — exactly what `npm run -s cli -- groebner FILE`
 *   starts, minus npm's own start-up (the launcher runs a cached bundle of domain/cli/main.ts;
 *   run.ts builds it before any timing);
 * - SymPy: Debian's `/usr/bin/python3` running bench/reference/sympy_groebner.py;
 * - Singular: `/usr/bin/Singular -q SCRIPT` with a script from singular-script.ts (written
 *   before the clock starts).
 */
import { execFileSync } from "node:child_process";
import { existsSync, writeFileSync } from "node:fs";
import { join } from "node:path";
import { singularScript } from "./singular-script";
import type { SystemFile } from "./system-file";

export type ToolId = "ours" | "sympy" | "singular";
export const TOOL_IDS: readonly ToolId[] = ["ours", "sympy", "singular"];

export interface Invocation {
  readonly command: string;
  readonly args: readonly string[];
}

export interface Tool {
  readonly id: ToolId;
  readonly label: string;
  /** Undefined when usable, else why not (shown as n/a). */
  readonly unavailable: string | undefined;
  readonly version: string;
  /** Exit code meaning "this system is outside what the tool can do" (shown as n/a). */
  readonly unsupportedExitCode?: number;
  invocation(systemPath: string, system: SystemFile, scratchDir: string, prime?: bigint): Invocation;
}

function tryRun(command: string, args: string[], cwd: string): string | undefined {
  try {
    return execFileSync(command, args, { cwd, encoding: "utf8", stdio: ["ignore", "pipe", "pipe"], timeout: 30_000 }).trim();
  } catch {
    return undefined;
  }
}

const fieldArgs = (prime?: bigint): string[] => (prime === undefined ? [] : ["--field", `${prime}`]);

export type Launcher = "bundle" | "tsx" | "node";
export const LAUNCHERS: readonly Launcher[] = ["bundle", "tsx", "node"];

/**
 * launcher "bundle": `node scripts/cli.mjs`, exactly as `npm run cli` does (a cached esbuild
 * bundle, rebuilt when domain/ changes); "tsx": the tsx binary (it starts a second Node process
 * with its loader); "node": `node --import tsx`, a single process transpiling on the fly.
 */
export function oursStart(root: string, launcher: Launcher = "bundle"): Invocation & { label: string } {
  const tsx = join(root, "node_modules", ".bin", "tsx");
  const main = join(root, "domain", "cli", "main.ts");
  const starts: Record<Launcher, Invocation & { label: string }> = {
    bundle: { command: process.execPath, args: [join(root, "scripts", "cli.mjs")], label: "node scripts/cli.mjs (bundle built before timing)" },
    tsx: { command: tsx, args: [main], label: "node_modules/.bin/tsx" },
    node: { command: process.execPath, args: ["--import", "tsx", main], label: "node --import tsx" },
  };
  return starts[launcher];
}

export function oursTool(root: string, launcher: Launcher = "bundle"): Tool {
  const main = join(root, "domain", "cli", "main.ts");
  const start = oursStart(root, launcher);
  return {
    id: "ours",
    label: "ours",
    unavailable: existsSync(main) ? undefined : "domain/cli/main.ts does not exist yet",
    version: `node ${process.version}, started by ${start.label}`,
    invocation: (systemPath, _s, _d, prime) => ({ command: start.command, args: [...start.args, "groebner", systemPath, ...fieldArgs(prime)] }),
  };
}

export function sympyTool(root: string): Tool {
  const python = "/usr/bin/python3";
  const version = tryRun(python, ["-c", "import sympy; print(sympy.__version__)"], root);
  return {
    id: "sympy",
    label: "SymPy",
    unavailable: version ? undefined : "/usr/bin/python3 cannot import sympy (apt-get install python3-sympy)",
    version: version ? `SymPy ${version} (Debian python3-sympy, /usr/bin/python3)` : "",
    unsupportedExitCode: 3,
    invocation: (systemPath, _s, _d, prime) => ({
      command: python,
      args: [join(root, "bench", "reference", "sympy_groebner.py"), systemPath, ...fieldArgs(prime)],
    }),
  };
}

export function singularTool(root: string): Tool {
  const binary = "/usr/bin/Singular";
  const banner = existsSync(binary) ? tryRun(binary, ["--version"], root) : undefined;
  return {
    id: "singular",
    label: "Singular",
    unavailable: banner ? undefined : "/usr/bin/Singular not installed (Debian package singular)",
    version: banner ? banner.split("\n")[0].replace(/\s+/g, " ") : "",
    invocation: (systemPath, system, scratchDir, prime) => {
      const name = systemPath.split("/").pop()!.replace(/\.txt$/, "");
      const script = join(scratchDir, `${name}${prime === undefined ? "" : `-p${prime}`}.sing`);
      writeFileSync(script, singularScript(system, prime));
      return { command: binary, args: ["-q", "--no-rc", script] };
    },
  };
}
