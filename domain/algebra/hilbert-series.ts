/**
 * Hilbert series of a quotient by a monomial ideal: for M = ⟨m_1, …, m_r⟩ ⊂ k[x_1, …, x_m],
 * HS(k[x]/M) = N(t) / (1 − t)^m, and this module computes the numerator N exactly (integer
 * coefficients, index = degree).
 *
 * The recursion is the pivot rule of Bigatti, "Computation of Hilbert–Poincaré series", J. Pure
 * Appl. Algebra 119, 1997 (also Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed.
 * 2015, ch. 9 §2; both references recalled from memory; the recursion is re-derived here): for a monomial p, the exact sequence 0 → k[x]/(M : p)(−deg p) → k[x]/M →
 * k[x]/(M + ⟨p⟩) → 0 gives N(M) = N(M + ⟨p⟩) + t^deg p · N(M : p). Generators with pairwise
 * disjoint supports form a regular sequence, so N = Π (1 − t^deg m_i) ends the recursion.
 *
 * Pivot here: p = x_j^e for the variable x_j that most minimal generators contain (at least two,
 * else the supports are disjoint) and e its least positive exponent among them. Then M + ⟨p⟩
 * replaces at least two generators by p and M : p lowers x_j in at least two, so the sum of the
 * generators' degrees falls in both branches and the recursion ends.
 *
 * Example: M = ⟨x^2, xy⟩ in k[x, y]: N = 1 − 2t^2 + t^3 (dimensions 1, 2, 1, 1, 1, … by degree).
 */

/** N(t) with HS(k[x_1..x_m]/⟨gens⟩) = N(t)/(1 − t)^m; `gens` are exponent vectors of length m. */
export function hilbertNumerator(gens: readonly (readonly number[])[], m: number, tick: () => void = () => {}): bigint[] {
  for (const g of gens) {
    if (g.length !== m) throw new RangeError(`hilbertNumerator: a generator has ${g.length} exponents, expected ${m}`);
  }
  return trim(numerator(minimalise(gens.map((g) => [...g])), m, tick));
}

/** Do two numerators (of the same number of variables) agree, i.e. are the Hilbert series equal? */
export function sameNumerator(a: readonly bigint[], b: readonly bigint[]): boolean {
  const x = trim([...a]), y = trim([...b]);
  return x.length === y.length && x.every((c, i) => c === y[i]);
}

function numerator(gens: number[][], m: number, tick: () => void): bigint[] {
  tick();
  if (gens.length === 0) return [1n];
  const count = new Array<number>(m).fill(0);
  for (const g of gens) for (let j = 0; j < m; j++) if (g[j] > 0) count[j]++;
  let j = 0;
  for (let k = 1; k < m; k++) if (count[k] > count[j]) j = k;
  if (count[j] < 2) {
    // Disjoint supports: a regular sequence.
    let out: bigint[] = [1n];
    for (const g of gens) out = minusShifted(out, out, degree(g));
    return out;
  }
  let e = Infinity;
  for (const g of gens) if (g[j] > 0 && g[j] < e) e = g[j];
  const p = new Array<number>(m).fill(0);
  p[j] = e;
  const sum = minimalise([...gens.filter((g) => g[j] < e), p]);
  const quotient = minimalise(gens.map((g) => g.map((x, k) => (k === j ? Math.max(0, x - e) : x))));
  return plusShifted(numerator(sum, m, tick), numerator(quotient, m, tick), e);
}

/** The minimal generators (no one divides another; duplicates once). */
function minimalise(gens: number[][]): number[][] {
  const sorted = [...gens].sort((a, b) => degree(a) - degree(b));
  const out: number[][] = [];
  for (const g of sorted) if (!out.some((h) => divides(h, g))) out.push(g);
  return out;
}

function divides(a: readonly number[], b: readonly number[]): boolean {
  for (let k = 0; k < a.length; k++) if (a[k] > b[k]) return false;
  return true;
}

function degree(g: readonly number[]): number {
  let d = 0;
  for (const x of g) d += x;
  return d;
}

/** a + t^s · b */
function plusShifted(a: readonly bigint[], b: readonly bigint[], s: number): bigint[] {
  const out = new Array<bigint>(Math.max(a.length, b.length + s)).fill(0n);
  a.forEach((c, i) => (out[i] += c));
  b.forEach((c, i) => (out[i + s] += c));
  return out;
}

/** a − t^s · b */
function minusShifted(a: readonly bigint[], b: readonly bigint[], s: number): bigint[] {
  return plusShifted(a, b.map((c) => -c), s);
}

function trim(a: bigint[]): bigint[] {
  let k = a.length;
  while (k > 1 && a[k - 1] === 0n) k--;
  return a.slice(0, k);
}
