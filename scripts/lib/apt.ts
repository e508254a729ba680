import { spawnSync } from "node:child_process";
import { existsSync, rmSync, writeFileSync } from "node:fs";
import { log } from "./log";

const POLICY = "/usr/sbin/policy-rc.d";

/**
 * apt-get install, non-interactive. While it runs, a policy-rc.d that exits 101 stops
 * packages from starting their own services (Debian's postgresql would otherwise start a
 * cluster on port 5432). Needs root, or password-less sudo.
 */
export function aptInstall(packages: string[]) {
  const isRoot = process.getuid?.() === 0;
  const prefix = isRoot ? [] : ["sudo", "-n"];
  if (!isRoot && spawnSync("sudo", ["-n", "true"]).status !== 0) {
    throw new Error(
      `missing system packages: ${packages.join(" ")}. Install them with: sudo apt-get install -y ${packages.join(" ")}`,
    );
  }
  const run = (args: string[]) => {
    const [cmd, ...rest] = [...prefix, ...args];
    return spawnSync(cmd, rest, {
      stdio: "inherit",
      env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
    }).status;
  };
  const placedPolicy = isRoot && !existsSync(POLICY);
  if (placedPolicy) writeFileSync(POLICY, "#!/bin/sh\nexit 101\n", { mode: 0o755 });
  try {
    log("apt", `installing ${packages.join(" ")}`);
    const install = ["apt-get", "install", "-y", ...packages];
    if (run(install) === 0) return;
    // Package lists may be missing or stale on a fresh machine.
    if (run(["apt-get", "update"]) !== 0 || run(install) !== 0) {
      throw new Error(`apt-get install ${packages.join(" ")} failed`);
    }
  } finally {
    if (placedPolicy) rmSync(POLICY, { force: true });
  }
}
