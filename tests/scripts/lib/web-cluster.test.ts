import http from "node:http";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { freePort } from "../../../scripts/db/postgres";
import { startProcess } from "../../../scripts/lib/processes";
import { webProcesses } from "../../../scripts/lib/web-cluster";

describe("webProcesses", () => {
  it("defaults to one per core (at most 4) and reads WEB_PROCESSES as a count", () => {
    expect(webProcesses(undefined, 2)).toBe(2);
    expect(webProcesses("", 1)).toBe(1);
    expect(webProcesses(undefined, 16)).toBe(4);
    expect(webProcesses("1", 8)).toBe(1);
    expect(webProcesses(" 3 ", 2)).toBe(3);
    expect(() => webProcesses("two", 2)).toThrow(/WEB_PROCESSES must be a whole number/);
    expect(() => webProcesses("0", 2)).toThrow(/from 1 to 64/);
  });
});

/** The pid that answers on a fresh connection (the primary deals connections round-robin), or null. */
function pidAt(port: number): Promise<number | null> {
  return new Promise((resolve) => {
    const req = http.get({ host: "127.0.0.1", port, path: "/", agent: false }, (res) => {
      let body = "";
      res.on("data", (c: Buffer) => (body += c));
      res.on("end", () => resolve(Number(body) || null));
    });
    req.on("error", () => resolve(null));
    // A connection dealt to a process that is just dying gets no answer: count it as none.
    req.setTimeout(2_000, () => req.destroy());
  });
}

async function answering(port: number, tries = 12): Promise<Set<number>> {
  const pids = new Set<number>();
  for (let i = 0; i < tries; i++) {
    const pid = await pidAt(port);
    if (pid) pids.add(pid);
  }
  return pids;
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

async function until<T>(what: string, probe: () => Promise<T | undefined>, deadlineMs = 30_000): Promise<T> {
  const end = Date.now() + deadlineMs;
  for (;;) {
    const value = await probe();
    if (value !== undefined) return value;
    if (Date.now() > end) throw new Error(`gave up waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

describe("several web processes (scripts/lib/web-cluster.ts)", () => {
  it("serves from two processes, replaces one that is killed, and stops them all on SIGTERM", async () => {
    const port = await freePort();
    const app = startProcess("cluster-app", path.resolve("node_modules/.bin/tsx"), [path.join("tests", "scripts", "fixtures", "cluster-app.ts")], {
      env: { ...process.env, PORT: String(port) },
      quiet: true,
    });
    try {
      const first = await until("two web processes", async () => {
        const pids = await answering(port);
        return pids.size === 2 ? pids : undefined;
      });
      const [victim, survivor] = [...first];
      process.kill(victim!, "SIGKILL");
      const second = await until("a replacement process", async () => {
        const pids = await answering(port);
        return pids.size === 2 && !pids.has(victim!) ? pids : undefined;
      });
      expect(second.has(survivor!)).toBe(true);
      expect(alive(victim!)).toBe(false);

      await app.stop();
      expect(await app.exited).toBe(0);
      for (const pid of second) await until(`web process ${pid} to end`, async () => (alive(pid) ? undefined : true), 10_000);
    } finally {
      await app.stop();
    }
  }, 60_000);
});
