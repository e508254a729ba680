import { randomInt } from "../../support/prng";

/** CSV text of a random small network (species X1..Xk, coefficients 0..2, any arrow), seeded. */
export function randomNetworkCsv(rand: () => number): string {
  const speciesCount = randomInt(rand, 1, 6);
  const rowCount = randomInt(rand, 1, 7);
  const side = (): string => {
    const terms: string[] = [];
    for (let s = 1; s <= speciesCount; s++) {
      if (rand() < 0.3) {
        const c = randomInt(rand, 1, 2);
        terms.push(c === 1 ? `X${s}` : rand() < 0.5 ? `${c}X${s}` : `${c} X${s}`);
      }
    }
    return terms.length === 0 ? "0" : terms.join(" + ");
  };
  const lines = ["reaction,rate_value"];
  while (lines.length <= rowCount) {
    const l = side();
    const r = side();
    if (l.replace(/ /g, "") === r.replace(/ /g, "")) continue;
    const arrow = ["->", "<-", "<->"][randomInt(rand, 0, 2)];
    lines.push(`${l} ${arrow} ${r},${rand() < 0.5 ? randomInt(rand, 1, 9) : ""}`);
  }
  return lines.join("\n") + "\n";
}
