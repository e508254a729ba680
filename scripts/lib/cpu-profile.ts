/**
 * `CPU_PROFILE_DIR=dir` makes a web process record a V8 CPU profile (the format of
 * `node --cpu-prof`, which NODE_OPTIONS does not accept) from start until it is stopped, written
 * as dir/web-<pid>.cpuprofile: for `npm run bench -- --load --profile dir`. Unset, nothing runs.
 */
import { mkdirSync, writeFileSync } from "node:fs";
import { Session } from "node:inspector/promises";
import path from "node:path";

export async function startCpuProfile(dir: string | undefined): Promise<(() => Promise<void>) | undefined> {
  if (!dir) return undefined;
  const session = new Session();
  session.connect();
  await session.post("Profiler.enable");
  // 1 ms between samples (V8's default is 1 ms too for --cpu-prof).
  await session.post("Profiler.setSamplingInterval", { interval: 1000 });
  await session.post("Profiler.start");
  return async () => {
    const { profile } = await session.post("Profiler.stop");
    mkdirSync(dir, { recursive: true });
    writeFileSync(path.join(dir, `web-${process.pid}.cpuprofile`), JSON.stringify(profile));
    session.disconnect();
  };
}
