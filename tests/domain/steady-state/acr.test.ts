import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { acrByGroebner, acrText } from "@domain/steady-state/acr";
import { kineticsRing } from "@domain/steady-state/kinetics";
import { steadyStateSystem } from "@domain/steady-state/system";
import { analyseCsv } from "./helpers";

const rowsOf = (csv: string) => {
  const net = parseNetworkCsv(csv);
  const kin = kineticsRing(net);
  const sys = steadyStateSystem(net, kin, [], null);
  return { kin, rows: sys.keptRows.map((i) => sys.odes[i]) };
};

describe("absolute concentration robustness (Shinar & Feinberg, Science 327, 2010)", () => {
  it("the Gröbner test finds A = k2/k1 in A + B -> 2B, B -> A and rejects B", () => {
    const { kin, rows } = rowsOf("reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n");
    const found = acrByGroebner(kin, rows, "A", {});
    expect(found && acrText(found)).toEqual({ species: "A", value: "k2/k1" });
    expect(acrByGroebner(kin, rows, "B", {})).toBeNull();
  });

  it("a species with three steady-state values (cubic autocatalysis) is not robust", () => {
    const { kin, rows } = rowsOf("reaction,rate,reverse_rate,rate_value,reverse_rate_value\n0 <-> X,k1,k2,6,11\n2X <-> 3X,k3,k4,6,1\n");
    expect(acrByGroebner(kin, rows, "X", {})).toBeNull();
  });

  it("without a parametrisation the analysis still reports ACR species (elimination or basis)", () => {
    const r = analyseCsv(
      "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + B -> 2B,k1,,2,\nB -> A,k2,,3,\n0 <-> X,k3,k4,6,11\n2X <-> 3X,k5,k6,6,1\n",
      { skipFullBasis: true },
    );
    expect(r.parametrisation).toBeNull();
    expect(r.acr).toEqual([{ species: "A", value: "3/2" }]);
  });
});
