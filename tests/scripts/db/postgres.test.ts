import { existsSync, statSync } from "node:fs";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { ensureDatabase, findPgBin, portIsFree, serverUrl, startThrowawayCluster } from "../../../scripts/db/postgres";

describe.skipIf(!findPgBin())("throw-away PostgreSQL cluster", () => {
  let cluster: Awaited<ReturnType<typeof startThrowawayCluster>>;
  beforeAll(async () => {
    cluster = await startThrowawayCluster();
  });
  afterAll(() => cluster?.dispose());

  async function query(sql: string, database = "postgres") {
    const client = new pg.Client({ connectionString: serverUrl(cluster.port, database) });
    await client.connect();
    try {
      return (await client.query(sql)).rows;
    } finally {
      await client.end();
    }
  }

  it("listens on loopback only, with no Unix socket, and fsync off", async () => {
    expect(await query("SHOW listen_addresses")).toEqual([{ listen_addresses: "127.0.0.1" }]);
    expect(await query("SHOW unix_socket_directories")).toEqual([{ unix_socket_directories: "" }]);
    expect(await query("SHOW fsync")).toEqual([{ fsync: "off" }]);
  });

  it("keeps its data in a folder owned by an unprivileged user", () => {
    const owner = statSync(cluster.cluster.dataDir).uid;
    if (process.getuid?.() === 0) expect(owner).not.toBe(0);
    else expect(owner).toBe(process.getuid?.());
  });

  it("creates a database once, however often asked", async () => {
    await ensureDatabase(cluster.port, "twice");
    await ensureDatabase(cluster.port, "twice");
    expect(await query("SELECT count(*)::int AS n FROM pg_database WHERE datname = 'twice'")).toEqual([{ n: 1 }]);
    expect(await query("SELECT current_database() AS d", "twice")).toEqual([{ d: "twice" }]);
  });

  it("stops cleanly and removes its folder", async () => {
    const { port } = cluster;
    const dir = cluster.cluster.dir;
    cluster.dispose();
    expect(await portIsFree(port)).toBe(true);
    expect(existsSync(dir)).toBe(false);
    cluster = undefined as never;
  });
});
