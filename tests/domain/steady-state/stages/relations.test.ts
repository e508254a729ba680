import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { Budget } from "@domain/steady-state/budget";
import { relationsStage } from "@domain/steady-state/stages/relations";
import { structureStage } from "@domain/steady-state/stages/structure";
import { systemStage } from "@domain/steady-state/stages/system";

const net = parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n");

describe("stage 7: relations", () => {
  it("k1*A - k2*B vanishes at every positive steady state of A <-> B (detailed balance)", () => {
    const options = { relations: ["k1*A - k2*B"] };
    const s = structureStage(net, options);
    const r = relationsStage(net, options, s, systemStage(net, options, s), new Budget({ timeoutMs: 20_000 }));
    expect(r.relations).toEqual([expect.objectContaining({ vanishes: true })]);
  });

  it("a relation that does not parse is a typed input problem (the edges word it)", () => {
    const options = { relations: ["(("] };
    const s = structureStage(net, options);
    expect(() => relationsStage(net, options, s, systemStage(net, options, s), new Budget({ timeoutMs: 20_000 }))).toThrow(
      expect.objectContaining({ problem: expect.objectContaining({ kind: "relation-syntax", relation: "((" }) }),
    );
  });
});
