import http from "node:http";
import type { AddressInfo } from "node:net";
import { describe, expect, it } from "vitest";
import { closedLoop, makeTarget, quantile, send, summarise } from "../../../bench/lib/load-generator";

describe("quantile (nearest rank)", () => {
  it("picks the value at rank ceil(q·n)", () => {
    const v = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];
    expect(quantile(v, 0.5)).toBe(5);
    expect(quantile(v, 0.95)).toBe(10);
    expect(quantile([7], 0.99)).toBe(7);
    expect(quantile([], 0.5)).toBeNaN();
  });
});

describe("summarise", () => {
  it("counts errors per route and adds an 'all' row", () => {
    const rows = summarise(
      [
        { route: "a", ms: 10, status: 200 },
        { route: "a", ms: 30, status: 500, error: "status 500" },
        { route: "b", ms: 20, status: 200 },
      ],
      2,
    );
    expect(rows.map((r) => [r.route, r.requests, r.errors, r.perSecond])).toEqual([
      ["a", 2, 1, 1],
      ["b", 1, 0, 0.5],
      ["all", 3, 1, 1.5],
    ]);
    expect(rows[0]!.reasons).toEqual(["status 500"]);
  });
});

describe("closedLoop", () => {
  it("never has more requests in flight than users, and counts unexpected statuses and timeouts as errors", async () => {
    let inFlight = 0;
    let most = 0;
    const server = http.createServer((req, res) => {
      inFlight++;
      most = Math.max(most, inFlight);
      const finish = () => {
        inFlight--;
        res.writeHead(req.url === "/missing" ? 404 : 200).end("ok");
      };
      if (req.url === "/hang") return void setTimeout(finish, 2_000);
      setTimeout(finish, 5);
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", r));
    const port = (server.address() as AddressInfo).port;
    try {
      const target = makeTarget("127.0.0.1", port, 3);
      const samples = await closedLoop(target, 3, 0.3, () => [{ route: "ok", path: "/" }]);
      expect(samples.length).toBeGreaterThan(3);
      expect(most).toBeLessThanOrEqual(3);
      expect(samples.every((s) => s.error === undefined)).toBe(true);
      expect((await send(target, { route: "m", path: "/missing" })).error).toBe("status 404");
      const quick = makeTarget("127.0.0.1", port, 1, 100);
      expect((await send(quick, { route: "h", path: "/hang" })).error).toMatch(/no answer within 100 ms/);
      target.agent.destroy();
      quick.agent.destroy();
    } finally {
      server.closeAllConnections();
      await new Promise<void>((r) => server.close(() => r()));
    }
  });
});
