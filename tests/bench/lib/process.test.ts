import { describe, expect, it } from "vitest";
import { benchEnvironment, parseTimeReport } from "../../../bench/lib/process";

describe("parseTimeReport (GNU time with -f '%U %S %M')", () => {
  it("adds user and system seconds and reads peak memory in kB", () => {
    expect(parseTimeReport("1.50 0.25 90000\n")).toEqual({ cpuSeconds: 1.75, maxRssKb: 90000 });
  });
  it("uses the last line, after GNU time's note on a non-zero exit", () => {
    expect(parseTimeReport("Command exited with non-zero status 2\n0.01 0.00 10556\n")).toEqual({ cpuSeconds: 0.01, maxRssKb: 10556 });
  });
  it("returns undefined for anything else, e.g. a run killed before GNU time wrote", () => {
    expect(parseTimeReport("")).toBeUndefined();
    expect(parseTimeReport("Command terminated by signal 9\n")).toBeUndefined();
  });
});

describe("benchEnvironment", () => {
  it("drops NODE_EXTRA_CA_CERTS and keeps everything else", () => {
    const env = benchEnvironment({ PATH: "/usr/bin", NODE_EXTRA_CA_CERTS: "/tmp/extra.pem", LANG: "C" });
    expect(env).toEqual({ PATH: "/usr/bin", LANG: "C" });
  });
});
