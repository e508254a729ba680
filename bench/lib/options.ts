/**
 * Command-line options of `npm run bench`.
 *
 * Example: parseBenchOptions(["--only", "katsura-5,cyclic-5", "--repeat", "5"]) gives
 * only ["katsura-5", "cyclic-5"], repeat 5 and the defaults for the rest.
 */
import { LAUNCHERS, TOOL_IDS, type Launcher, type ToolId } from "./tools";

export interface BenchOptions {
  readonly only: readonly string[] | undefined;
  readonly repeat: number;
  readonly timeout: number;
  /** A run longer than this many seconds is not repeated (its single time is the median). */
  readonly long: number;
  readonly quick: boolean;
  readonly prime: bigint | undefined;
  readonly tools: readonly ToolId[];
  /** How our CLI starts: `bundle` (`node scripts/cli.mjs`, as `npm run cli` does), `tsx` or `node` (`node --import tsx`). */
  readonly launcher: Launcher;
  /** Run the issue-4 target (analyse with symbolic rates vs Singular's brute force) instead of the systems. */
  readonly analyse: boolean;
  readonly help: boolean;
}

export const DEFAULT_OPTIONS: BenchOptions = {
  only: undefined,
  repeat: 3,
  timeout: 120,
  long: 30,
  quick: false,
  prime: undefined,
  tools: TOOL_IDS,
  launcher: "bundle",
  analyse: false,
  help: false,
};

export const USAGE = `npm run bench -- [options]
  --only a,b        run only these systems (names of bench/systems/*.txt without .txt)
  --quick           only the small systems (seconds each), for CI-sized runs
  --repeat N        runs per program and system, median reported (default 3)
  --timeout S       per-run limit in seconds; a killed run shows as ">S s" (default 120)
  --long S          a run longer than S seconds is not repeated (default 30)
  --field P         compute over Z/P instead of Q (all three programs)
  --tools a,b       subset of ours,sympy,singular (default all)
  --launcher L      start our CLI with "bundle" (default: node scripts/cli.mjs, as npm run cli does),
                    "tsx" (tsx domain/cli/main.ts) or "node" (node --import tsx domain/cli/main.ts)
  --analyse         instead of the systems: our analyse of the two-site phosphorylation cycle with
                    twelve symbolic rate constants (parametrisation, checked) next to Singular's
                    brute-force block-order std of the same steady-state system
  --truth           instead: positive steady-state counts of analyse on seeded random networks against
                    multistart Newton and Singular (--count N, default 300; --seed S; --timeout S per network)
  --nsite           instead: analyse --json of the n-site phosphorylation cycle (numeric) for n = 1..5
                    beside Singular's saturated lex basis (--max N, --timeout S)
  --help            this text`;

export class BenchOptionError extends Error {}

function positive(flag: string, value: string | undefined): number {
  const x = Number(value);
  if (value === undefined || !Number.isFinite(x) || x <= 0) throw new BenchOptionError(`${flag} needs a positive number, got ${value ?? "nothing"}`);
  return x;
}

export function parseBenchOptions(argv: readonly string[]): BenchOptions {
  let o: BenchOptions = { ...DEFAULT_OPTIONS };
  for (let i = 0; i < argv.length; i++) {
    const flag = argv[i];
    const value = (): string | undefined => argv[++i];
    switch (flag) {
      case "--only":
        o = { ...o, only: (value() ?? "").split(",").map((s) => s.trim()).filter((s) => s !== "") };
        if (o.only!.length === 0) throw new BenchOptionError("--only needs a comma-separated list of systems");
        break;
      case "--repeat": {
        const n = positive(flag, value());
        if (!Number.isInteger(n)) throw new BenchOptionError("--repeat needs a whole number");
        o = { ...o, repeat: n };
        break;
      }
      case "--timeout":
        o = { ...o, timeout: positive(flag, value()) };
        break;
      case "--long":
        o = { ...o, long: positive(flag, value()) };
        break;
      case "--quick":
        o = { ...o, quick: true };
        break;
      case "--field": {
        const v = value();
        if (!v || !/^\d+$/.test(v) || BigInt(v) < 2n) throw new BenchOptionError(`--field needs a prime, got ${v ?? "nothing"}`);
        o = { ...o, prime: BigInt(v) };
        break;
      }
      case "--tools": {
        const list = (value() ?? "").split(",").map((s) => s.trim());
        const bad = list.find((t) => !TOOL_IDS.includes(t as ToolId));
        if (bad !== undefined) throw new BenchOptionError(`--tools: unknown program "${bad}" (known: ${TOOL_IDS.join(", ")})`);
        o = { ...o, tools: list as ToolId[] };
        break;
      }
      case "--launcher": {
        const v = value();
        if (!LAUNCHERS.includes(v as Launcher)) throw new BenchOptionError(`--launcher needs ${LAUNCHERS.join(", ")}, got ${v ?? "nothing"}`);
        o = { ...o, launcher: v as Launcher };
        break;
      }
      case "--analyse":
        o = { ...o, analyse: true };
        break;
      case "--help":
      case "-h":
        o = { ...o, help: true };
        break;
      default:
        throw new BenchOptionError(`unknown option "${flag}"\n${USAGE}`);
    }
  }
  return o;
}
