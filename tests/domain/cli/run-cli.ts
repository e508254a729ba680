import { main } from "@domain/cli/main";
import type { CliIO } from "@domain/cli/io";

/** Runs the CLI in-process against an in-memory file system; returns the exit code and both streams. */
export async function cli(argv: string[], files: Record<string, string>) {
  let out = "", err = "";
  const io: CliIO = {
    readFile: (p) => {
      if (!(p in files)) throw Object.assign(new Error("no such file"), { code: "ENOENT" });
      return files[p];
    },
    stdout: (t) => void (out += t),
    stderr: (t) => void (err += t),
  };
  const code = await main(argv, io);
  return { code, out, err };
}
