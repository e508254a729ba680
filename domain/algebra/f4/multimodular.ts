import { AlgebraError } from "../errors";
import { QQ } from "../field";
import type { MonomialComparator } from "../order";
import { makeComparator } from "../order";
import type { Polynomial } from "../polynomial";
import { normalizeTerms } from "../polynomial";
import type { Rational } from "../rational";
import { gcdBig } from "../rational";
import { PolynomialRing } from "../ring";
import { integerCoefficients } from "../groebner/coefficients";
import { clearDenominators, toEngine } from "../groebner/convert";
import type { Limits } from "../groebner/limits";
import type { EPoly } from "../groebner/reduce";
import { verifyGroebner } from "../groebner/verify";
import { ZeroTest } from "../groebner/zero-test";
import type { F4Poly, F4Stats } from "./f4";
import { f4ModP } from "./f4";
import { homogenisedF4ModP } from "./homogenised-image";
import { invModP } from "./modp";
import { primesBelow } from "./modp";
import { MonomialTable } from "./monomial-table";
import { isGradedOrder } from "./prime-field";
import type { F4Trace, ReplayStats } from "./trace";
import { F4Recorder, decodeTrace, encodeTrace, replayF4 } from "./trace";
import { hilbertNumerator, sameNumerator } from "../hilbert-series";
import { bitLength, crtStep, guidedReconstruction, rationalModP } from "./reconstruction";

/**
 * Primes for lifting: below 2^21, so p² < 2^42 and a dense row takes ~2000 additions before an
 * entry needs reducing (modp.ts). Measured here on katsura-7 mod p (one F4 run, busy machine):
 * about 0.7 s for p < 2^20 against 1.2 s for p < 2^26, which outweighs the 24 % more primes.
 */
const LIFT_PRIME_LIMIT = 2 ** 21;

/** Where the time of a multi-modular run went (ms), for the bench and the tests. */
export interface MultiModularStats {
  primes: number;
  unlucky: number;
  modularMs: number;
  liftMs: number;
  proofMs: number;
  /** Of proofMs: Buchberger's criterion (step 1). */
  criterionMs?: number;
  /** Which proof step failed, when the result could not be proven (the caller falls back). */
  failed?: "groebner" | "inputs" | "hilbert" | "membership" | "series" | "primes";
}

export interface MultiModularOptions {
  /** Most primes to try before giving up (the caller falls back to another method). */
  readonly maxPrimes?: number;
  readonly stats?: MultiModularStats;
  /**
   * A proven Gröbner basis of the same ideal in another order of the same variables (in practice
   * grevlex, computed first). With it, proof step 3 is ideal membership instead of Hilbert
   * functions, so orders that are not degree-compatible (lex, block orders) can be lifted too.
   */
  readonly reference?: readonly Polynomial<Rational>[];
  /**
   * Prove a reconstructed candidate at once instead of first checking it against the basis modulo
   * one more prime (a wrong candidate fails the proof, and more primes follow). Pays when the proof
   * costs less than an image, as in block orders (two-site cycle, k3 and k6 symbolic: an image
   * ~60 ms, the proof with `reference` ~100 ms, but the check prime is one of six images).
   */
  readonly proveEarly?: boolean;
  /** Primes below this bound (default LIFT_PRIME_LIMIT, at most 2^26 for f4.ts). */
  readonly primeLimit?: number;
  /**
   * The generators are homogeneous and generate I^h (last variable h), where `reference` is a
   * proven grevlex basis of I in the other variables; the order is >_h (homogeniseInto). The
   * proof is then by Hilbert series instead of S-pairs (proveBatch, "series"), and the result is
   * the reduced basis of I^h in >_h, whose h = 1 is a Gröbner basis of I in > (homogenise.ts).
   */
  readonly series?: boolean;
  /**
   * Learn the F4 run at the first prime and replay it at the others (trace.ts; default true).
   * A traced lift whose proof fails is run again untraced, so the result never depends on it.
   */
  readonly traced?: boolean;
  /** Replays done and declined (a result left its learnt columns: F4 ran itself). */
  readonly replays?: ReplayStats;
  /**
   * Step 3's h-free leads at prime p, when the caller has them (groebner.ts's growth check
   * computes the same reduced basis of ⟨F^h⟩ mod p, homogenise.ts `homogenisedGrowth`).
   */
  readonly hFreeLeads?: { readonly p: number; readonly leads: readonly Int32Array[] };
}

/** One learnt run per multi-modular run: undefined until learnt, null when it cannot be replayed. */
export interface ImageTracing extends ReplayStats {
  trace: F4Trace | null | undefined;
  /**
   * Set where the trace is the run's own (learnt at its first prime, so the same in every process
   * of the run): a prime whose replay declines then gives an image flagged `declined`, which the
   * lift may set aside (ImageLifter.takesDecline). Asked at each decline: true = return it without
   * elements, not running F4 afresh (katsura-8: one prime in 28, ~330 ms saved on the lift's path).
   */
  onDecline?: () => boolean;
}

interface Lifted {
  mons: number[];
  index: Map<number, number>;
  vals: bigint[];
  /** Each coefficient's last reconstruction (guidedReconstruction tries it first on the next prime). */
  rats: (Rational | undefined)[];
  /**
   * Whether rats[i] is still ≡ vals[i] modulo the group's M: kept up to date one prime at a time
   * by combine (num ≡ residue·den mod p, word arithmetic), so that reconstruct takes such a
   * coefficient as it is instead of checking it modulo M with long numbers on every attempt.
   */
  sure: boolean[];
  /** The last image's monomials of this element and their indices here (images on one support share the array). */
  lastMons?: Int32Array;
  lastIdx?: Int32Array;
  /** Whether lastMons covers every monomial of `mons`. */
  lastCovers?: boolean;
}

interface Group {
  count: number;
  M: bigint;
  elems: Lifted[];
  candidate: { mons: number[]; coeffs: Rational[] }[] | null;
  /** Where reconstruction failed last time: tried first next time (cheap early exit). */
  failedAt: [number, number];
  /** No reconstruction is tried before the modulus has this many bits (see RETRY_GROWTH). */
  retryBits: number;
}

/**
 * After a failed reconstruction, wait until the modulus has grown by this factor before trying
 * again. Trying at every prime costs a maximal-quotient run on the failing coefficient each time,
 * O(k²) for k primes, so O(k³) in all: the four-site cycle with three-decimal constants (703
 * primes) spent 5.9 s of its 6.7 s lift there. With 3 % growth the tries cost a geometric sum,
 * and at most 3 % more primes are combined than needed (none below ~33 primes, where 3 % of the
 * bits is less than one prime of 21 bits).
 */
const RETRY_GROWTH = 1.03;

/**
 * `proveEarly` proves a reconstruction at once only up to this many primes; after that it waits
 * for a fresh prime to agree, as without the option. Early proofs pay where the basis lifts from
 * a few primes and a proof costs about one image (the two-site cycles: 3–4 primes); with hundreds
 * of primes an extra image costs a fraction of a percent, while a proof of a wrong reconstruction
 * on coefficients of thousands of bits runs for minutes. Measured here on the three-site cycle
 * with k3, k6 symbolic: the lift is stable at 407 primes (a fresh prime agrees), so the
 * reconstruction that `proveEarly` set out to prove at the 383rd was wrong, and that attempt had
 * not ended after 5 minutes.
 */
export const EARLY_PROOF_PRIMES = 8;

/**
 * What every worker needs to compute one image or one proof batch, as plain data: variables,
 * order and generators as exact text (ring.format / ring.parse round-trip exactly), and for lex
 * and block orders the proven grevlex basis that step 3 of the proof checks membership against.
 */
export interface MultiModularInput {
  readonly vars: readonly string[];
  readonly order: string;
  readonly polys: readonly string[];
  readonly reference?: readonly string[];
  /** Lift with primes below this bound (default 2^21); part of the input so every worker uses the same primes. */
  readonly primeLimit?: number;
  /** Generators of I^h for `reference`'s I, proof by Hilbert series (MultiModularOptions.series). */
  readonly series?: boolean;
}

/**
 * The reduced basis modulo one prime, as plain data: element e has `lengths[e]` terms (decreasing
 * in the order, so its first term is its leading monomial); `exps` holds their packed exponent
 * vectors [degree, e_1..e_n] one after another, `coeffs` their residues. encodeImage makes bytes of it.
 */
export interface ModularImage {
  readonly p: number;
  readonly n: number;
  readonly lengths: Int32Array;
  readonly exps: Int32Array;
  readonly coeffs: Int32Array;
  /**
   * The run's trace declined at p (ImageTracing.onDecline): with no elements, nothing else was
   * computed; with elements, F4 ran afresh and the image is as good as any.
   */
  readonly declined?: boolean;
}

/** Whether an image is only the note that the run's trace declined at its prime (no elements computed). */
export const isDeclinedOnly = (image: ModularImage): boolean => image.declined === true && image.lengths.length === 0;

/** A lifted basis that agreed with a fresh prime, not yet proven: the elements as exact text, and the primes used. */
export interface LiftCandidate {
  readonly basis: readonly string[];
  /** Primes whose images were combined (lucky), in the order used. */
  readonly primes: readonly number[];
  /** Primes set aside as unlucky (another leading-monomial set). */
  readonly unlucky: readonly number[];
  /** Primes set aside because the run's trace declined there (absent when none). */
  readonly declined?: readonly number[];
  /** The fresh prime the lift agreed with. */
  readonly checkedWith: number;
}

/**
 * One independent part of the exact proof (see multiModularGroebnerQQ): the S-pairs of
 * Buchberger's criterion whose index is `index` modulo `of`; every input reduces to zero; step 3
 * (Hilbert functions at prime `p`, or membership in the reference basis); for `series` inputs
 * instead: elements `index` modulo `of` lie in I^h, and (batch 0) the Hilbert series agree.
 */
export type ProofBatch =
  | { readonly kind: "pairs"; readonly index: number; readonly of: number }
  | { readonly kind: "inputs" }
  | { readonly kind: "hilbert"; readonly p: number }
  | { readonly kind: "membership" }
  | { readonly kind: "series"; readonly index: number; readonly of: number };

export type ProofOutcome = { readonly ok: true } | { readonly ok: false; readonly failed: NonNullable<MultiModularStats["failed"]> };

/** The first prime of liftPrimes for these generators (the Hilbert step's prime in graded orders). */
export function firstLiftPrime(polys: readonly Polynomial<Rational>[]): number {
  return liftPrimes(multiModularInput(polys)).next().value as number;
}

/** The input's ring, integer generators and monomial table, built once per input object and process. */
interface Prepared {
  readonly ring: PolynomialRing<Rational>;
  readonly graded: boolean;
  readonly integer: EPoly<bigint>[];
  readonly T: MonomialTable;
  readonly inputMons: Int32Array[];
  /** In the input ring's variables (h-free for `series`), grevlex. */
  readonly reference: Polynomial<Rational>[] | null;
  readonly series: boolean;
  /** Step 3's h-free leads per prime (the single-process run computes them with its first image). */
  readonly hFree: Map<number, HFreeLeads>;
  /** Interned monomials of an image's exponents (images decoded on a shared support share the array). */
  readonly interned: WeakMap<Int32Array, Int32Array[]>;
  /** Parsed candidates, so the single-process run does not re-parse its own. */
  readonly parsed: WeakMap<LiftCandidate, Polynomial<Rational>[]>;
  /** The same, primitive over Z and sorted, as the proof batches use them. */
  readonly integerCandidates: WeakMap<LiftCandidate, EPoly<bigint>[]>;
}

const prepared = new WeakMap<MultiModularInput, Prepared>();

/** The plain-data input for `polys` (and a grevlex `reference` for lex and block orders). */
export function multiModularInput(polys: readonly Polynomial<Rational>[], reference?: readonly Polynomial<Rational>[], primeLimit?: number, series = false): MultiModularInput {
  const ring = polys[0].ring;
  const nonzero = polys.filter((p) => p.coeffs.length > 0);
  const input: MultiModularInput = {
    vars: [...ring.vars],
    order: ring.orderName,
    polys: nonzero.map((p) => ring.format(p)),
    ...(reference ? { reference: reference.map((r) => r.ring.format(r)) } : {}),
    ...(primeLimit !== undefined ? { primeLimit } : {}),
    ...(series ? { series } : {}),
  };
  prepared.set(input, prepare(ring, nonzero, reference ? reference.map((r) => inGrevlexOf(ring, r)) : null, series));
  return input;
}

/** r (in the same variables, or in all but `ring`'s last) as a polynomial of `ring` in grevlex. */
function inGrevlexOf(ring: PolynomialRing<Rational>, r: Polynomial<Rational>): Polynomial<Rational> {
  const m = r.ring.n, n = ring.n;
  if (m === n) return r;
  if (m !== n - 1 || r.ring.vars.some((v, i) => ring.vars[i] !== v)) throw new AlgebraError("ring", "multi-modular input: the reference basis is in other variables");
  const exps = new Int32Array(r.coeffs.length * (n + 1));
  for (let t = 0; t < r.coeffs.length; t++) exps.set(r.exps.subarray(t * (m + 1), (t + 1) * (m + 1)), t * (n + 1));
  return normalizeTerms(ring.withOrder("grevlex"), r.coeffs, exps);
}

function prepare(ring: PolynomialRing<Rational>, polys: readonly Polynomial<Rational>[], reference: Polynomial<Rational>[] | null, series: boolean): Prepared {
  const n = ring.n;
  if (series && (reference === null || reference.some((r) => r.coeffs.length > 0 && hasLast(r)))) {
    throw new AlgebraError("domain", "multi-modular input: a Hilbert-series proof needs a reference basis free of the last variable h");
  }
  const integer = polys.filter((p) => p.coeffs.length > 0).map((p) => clearDenominators(toEngine(p)));
  const T = new MonomialTable(n);
  const inputMons = integer.map((f) => {
    const mons = new Int32Array(f.coeffs.length);
    for (let t = 0; t < mons.length; t++) mons[t] = T.intern(f.exps, t * (n + 1));
    return mons;
  });
  const graded = isGradedOrder(ring as Polynomial<unknown>["ring"]);
  return { ring, graded, integer, T, inputMons, reference, series, hFree: new Map(), interned: new WeakMap(), parsed: new WeakMap(), integerCandidates: new WeakMap() };
}

function preparedFor(input: MultiModularInput): Prepared {
  let p = prepared.get(input);
  if (!p) {
    const ring = new PolynomialRing(input.vars, QQ, input.order);
    const reference = input.reference ? input.reference.map((r) => ring.withOrder("grevlex").parse(r)) : null;
    p = prepare(ring, input.polys.map((s) => ring.parse(s)), reference, input.series === true);
    prepared.set(input, p);
  }
  return p;
}

/**
 * Whether the input can be lifted at all: graded orders always (step 3 by Hilbert functions),
 * others only with a reference basis.
 */
export function canLift(input: MultiModularInput): boolean {
  return preparedFor(input).graded || preparedFor(input).reference !== null;
}

/**
 * The primes to lift with, in the order every run uses them (largest first below 2^21), without
 * those dividing a leading coefficient of an integer generator (they change a leading monomial).
 * The same sequence on every worker, so which primes a run uses does not depend on who computed them.
 */
export function* liftPrimes(input: MultiModularInput): Generator<number> {
  for (const p of primesBelow(input.primeLimit ?? LIFT_PRIME_LIMIT)) if (isLiftPrime(input, p)) yield p;
}

/** Is p one of liftPrimes(input) (no leading coefficient of an integer generator a multiple of p)? Below the prime limit is the caller's. */
export function isLiftPrime(input: MultiModularInput, p: number): boolean {
  const P = BigInt(p);
  return !preparedFor(input).integer.some((f) => f.coeffs[0] % P === 0n);
}

/** The reduced basis modulo p by F4 (f4.ts), as plain data. `prime` only labels progress. */
export function imageModPrime(
  input: MultiModularInput,
  p: number,
  limits: Limits,
  prime?: { k: number; of: number },
  f4stats?: F4Stats,
  tracing?: ImageTracing,
): ModularImage {
  const pr = preparedFor(input);
  const { T, integer, inputMons } = pr;
  const n = pr.ring.n, S = n + 1;
  const P = BigInt(p);
  const polys: F4Poly[] = integer.map((f, i) => {
    const coeffs = new Int32Array(f.coeffs.length);
    for (let t = 0; t < coeffs.length; t++) {
      let c = Number(f.coeffs[t] % P);
      if (c < 0) c += p;
      coeffs[t] = c;
    }
    return dropZeros(inputMons[i], coeffs);
  });
  const stats = f4stats ?? { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 };
  let Gp: F4Poly[] | null = null;
  let declined = false;
  if (tracing?.trace) {
    Gp = replayF4(tracing.trace, polys, p, limits, prime);
    if (Gp) tracing.replayed++;
    else {
      tracing.declined++;
      declined = tracing.onDecline !== undefined;
      if (tracing.onDecline?.()) return { p, n, lengths: new Int32Array(0), exps: new Int32Array(0), coeffs: new Int32Array(0), declined: true };
    }
  }
  if (!Gp) {
    const recorder = tracing && tracing.trace === undefined ? new F4Recorder() : undefined;
    if (recorder) for (const f of polys) recorder.input(f);
    const f4options = { limits, ...(prime ? { prime } : {}), ...(recorder ? { recorder } : {}) };
    Gp = pr.graded
      ? f4ModP(polys, T, p, pr.ring.cmp, f4options, stats)
      : homogenisedF4ModP(polys, T, p, pr.ring.order, pr.ring.cmp, f4options, stats);
    if (recorder && tracing) tracing.trace = recorder.finish(Gp);
  }
  const image = toImage(pr, p, Gp);
  return declined ? { ...image, declined } : image;
}

/** A learnt F4 run of `input` (ImageTracing.trace) as bytes another process can load (trace.ts, encodeTrace). */
export function encodeImageTrace(input: MultiModularInput, trace: F4Trace): Uint8Array {
  const { T } = preparedFor(input);
  return encodeTrace(trace, T.S, (m) => T.exps.subarray(m * T.S, (m + 1) * T.S));
}

/** encodeImageTrace's bytes as a trace on this process' monomial table of `input`, to replay with imageModPrime. */
export function decodeImageTrace(input: MultiModularInput, bytes: Uint8Array): F4Trace {
  const { T } = preparedFor(input);
  return decodeTrace(bytes, T.S, (e, off) => T.intern(e, off));
}

/** A basis mod p (F4 polynomials of the input's monomial table) as plain data. */
function toImage(pr: Prepared, p: number, Gp: readonly F4Poly[]): ModularImage {
  const { T } = pr;
  const n = pr.ring.n, S = n + 1;
  let terms = 0;
  for (const g of Gp) terms += g.mons.length;
  const lengths = new Int32Array(Gp.length), exps = new Int32Array(terms * S), coeffs = new Int32Array(terms);
  let t = 0;
  Gp.forEach((g, e) => {
    lengths[e] = g.mons.length;
    for (let i = 0; i < g.mons.length; i++, t++) {
      exps.set(T.exps.subarray(g.mons[i] * S, g.mons[i] * S + S), t * S);
      coeffs[t] = g.coeffs[i];
    }
  });
  return { p, n, lengths, exps, coeffs };
}

/** The image's elements as F4 polynomials in the input's monomial table (monomials interned once per exponents array). */
function imagePolys(pr: Prepared, image: ModularImage): F4Poly[] {
  const S = image.n + 1;
  let monsOf = pr.interned.get(image.exps);
  if (!monsOf) {
    monsOf = [];
    let t = 0;
    for (let e = 0; e < image.lengths.length; e++) {
      const len = image.lengths[e];
      const mons = new Int32Array(len);
      for (let i = 0; i < len; i++) mons[i] = pr.T.intern(image.exps, (t + i) * S);
      monsOf.push(mons);
      t += len;
    }
    pr.interned.set(image.exps, monsOf);
  }
  const out: F4Poly[] = [];
  let t = 0;
  for (let e = 0; e < image.lengths.length; e++) {
    const len = image.lengths[e];
    out.push({ mons: monsOf[e], coeffs: image.coeffs.slice(t, t + len) });
    t += len;
  }
  return out;
}

/**
 * Chinese remaindering and rational reconstruction over images that arrive in liftPrimes order
 * (the caller adds them in that order, so the outcome is the same however many workers computed
 * them). `add` returns the candidate once the lift agrees with the image just added (a fresh
 * prime), else null. Images whose leading-monomial set is not the most frequent one are unlucky:
 * kept apart, never combined with the others.
 */
export class ImageLifter {
  private readonly pr: Prepared;
  private readonly groups = new Map<string, Group & { primes: number[] }>();
  private readonly seen: number[] = [];
  private fresh: (Group & { primes: number[] }) | null = null;
  private readonly declinedPrimes: number[] = [];
  /** Time spent combining and reconstructing (ms). */
  liftMs = 0;
  constructor(readonly input: MultiModularInput, private readonly tick: () => void = () => undefined) {
    this.pr = preparedFor(input);
  }

  /** Images combined so far (the one a candidate agreed with is not). */
  get count(): number {
    return this.seen.length;
  }

  /** Images combined but set aside so far (not in the most frequent leading-monomial set). */
  get unlucky(): number {
    let best = 0;
    for (const g of this.groups.values()) best = Math.max(best, g.count);
    return this.seen.length - best;
  }

  /**
   * The candidate the last `add` reconstructed, before any fresh prime checked it (`checkedWith`
   * 0): for `proveEarly`, where the exact proof is cheaper than one more image. Null when that add
   * reconstructed nothing.
   */
  reconstructed(): LiftCandidate | null {
    return this.fresh ? this.toCandidate(this.fresh, 0) : null;
  }

  /**
   * Whether the next image flagged `declined` is set aside rather than combined: at most one
   * such prime plus one per four combined. The decision depends only on the images added before,
   * in prime order, so every process of a run sets aside the same primes. A run's trace that
   * declines often (learnt at an unlucky prime) is still used: its images are then computed
   * afresh and combined.
   */
  takesDecline(): boolean {
    return this.declinedPrimes.length < 1 + Math.floor(this.seen.length / 4);
  }

  /** Forget the last reconstruction (its proof failed: too few primes); more images follow. */
  reject(): void {
    if (this.fresh) this.fresh.candidate = null;
    this.fresh = null;
  }

  private toCandidate(group: Group & { primes: number[] }, checkedWith: number): LiftCandidate {
    const { ring } = this.pr;
    const G = group.candidate!.map((g) => normalizeTerms(ring, g.coeffs, this.pr.T.packed(g.mons)));
    G.sort((a, b) => ring.cmp(a.exps, 0, b.exps, 0));
    const unlucky = this.seen.filter((p) => !group.primes.includes(p));
    const declined = this.declinedPrimes.length > 0 ? { declined: [...this.declinedPrimes] } : {};
    const cand: LiftCandidate = { basis: G.map((g) => ring.format(g)), primes: [...group.primes], unlucky, ...declined, checkedWith };
    this.pr.parsed.set(cand, G);
    return cand;
  }

  /** Combines one more image (a declined one is set aside while takesDecline; one without elements must be). */
  add(image: ModularImage): LiftCandidate | null {
    const t0 = Date.now();
    try {
      if (image.declined && this.takesDecline()) {
        this.declinedPrimes.push(image.p);
        this.fresh = null;
        return null;
      }
      if (isDeclinedOnly(image)) throw new AlgebraError("domain", `multi-modular lift: the image mod ${image.p} was not computed (its replay declined) and can no longer be set aside`);
      const Gp = imagePolys(this.pr, image);
      const key = Gp.map((g) => g.mons[0]).join(",");
      let group = this.groups.get(key);
      this.fresh = null;
      if (group && group.candidate && agreesModP(group.candidate, Gp, image.p)) return this.toCandidate(group, image.p);
      if (!group) {
        group = { count: 0, M: 1n, elems: Gp.map(() => ({ mons: [], index: new Map(), vals: [], rats: [], sure: [] })), candidate: null, failedAt: [0, 0], retryBits: 0, primes: [] };
        this.groups.set(key, group);
      }
      this.seen.push(image.p);
      combine(group, Gp, image.p);
      group.primes.push(image.p);
      let best: Group = group;
      for (const g of this.groups.values()) if (g.count > best.count) best = g;
      if (best === group) group.candidate = reconstruct(group, this.tick);
      if (best === group && group.candidate) this.fresh = group;
      return null;
    } finally {
      this.liftMs += Date.now() - t0;
    }
  }
}

/** The candidate from images in liftPrimes order, or null while the lift is not yet stable. */
export function liftImages(input: MultiModularInput, images: readonly ModularImage[], tick?: () => void): LiftCandidate | null {
  const lifter = new ImageLifter(input, tick);
  for (const image of images) {
    const c = lifter.add(image);
    if (c) return c;
  }
  return null;
}

/**
 * The proof of `candidate` cut into independent batches: the criterion's S-pairs in `pairBatches`
 * strided parts (stride, not ranges: neighbouring pairs have similar degrees, so each part gets a
 * fair share of the hard ones), the inputs, and step 3. The candidate is proven iff every batch is.
 */
export function proofBatches(input: MultiModularInput, candidate: LiftCandidate, pairBatches = 1): ProofBatch[] {
  const pr = preparedFor(input);
  const of = Math.max(1, Math.floor(pairBatches));
  if (pr.series) return Array.from({ length: of }, (_, index) => ({ kind: "series", index, of }) as const);
  return [
    ...Array.from({ length: of }, (_, index) => ({ kind: "pairs", index, of }) as const),
    { kind: "inputs" } as const,
    pr.graded ? ({ kind: "hilbert", p: liftPrimes(input).next().value as number } as const) : ({ kind: "membership" } as const),
  ];
}

/** Step 3's h-free leads at prime p (computed once per input, prime and process). */
function hFreeAt(pr: Prepared, p: number, limits: Limits): HFreeLeads {
  let h = pr.hFree.get(p);
  if (!h) {
    h = homogenisedLeads(pr.integer, p, pr.ring.order[0].kind === "grlex", limits);
    pr.hFree.set(p, h);
  }
  return h;
}

/** The candidate's elements as polynomials (parsed once per process). */
function candidatePolys(pr: Prepared, candidate: LiftCandidate): Polynomial<Rational>[] {
  let G = pr.parsed.get(candidate);
  if (!G) {
    // A candidate sent without its text (adoptIntegerCandidate) serves only the batches that need none.
    if (candidate.basis.length === 0) throw new AlgebraError("domain", "multi-modular proof: this batch needs the candidate's text, which was not sent");
    G = candidate.basis.map((s) => pr.ring.parse(s));
    pr.parsed.set(candidate, G);
  }
  return G;
}

/** The candidate primitive over Z and sorted, as the proof batches reduce with it (made once per process). */
function integerCandidatePolys(pr: Prepared, candidate: LiftCandidate, limits: Limits): EPoly<bigint>[] {
  let Gz = pr.integerCandidates.get(candidate);
  if (!Gz) {
    Gz = candidatePolys(pr, candidate).map((g) => {
      const z = clearDenominators(toEngine(g));
      integerCoefficients.normalize(z.coeffs, () => limits.checkTime()); // primitive: smaller numbers in the reductions
      return z;
    });
    Gz.sort((a, b) => pr.ring.cmp(a.exps, 0, b.exps, 0));
    pr.integerCandidates.set(candidate, Gz); // the next batch in this process starts from here
  }
  return Gz;
}

/** First word of encodeIntegerCandidate's bytes. */
const INTEGER_CANDIDATE_FORMAT = 0x5a43_0001;

/**
 * The candidate as the S-pair, input and membership batches use it (primitive over Z, sorted), as
 * bytes for the workers: header (format, n, elements, terms, text bytes), each element's length,
 * the exponent vectors, then the coefficients as signed hexadecimal text separated by commas.
 * A worker loads it with adoptIntegerCandidate instead of parsing the candidate's text and making
 * it primitive (katsura-8: 1.6 MB of text, ~370 ms in a fresh process, in every worker). The
 * coordinator derives both the text and these bytes from the same lifted polynomials.
 */
export function encodeIntegerCandidate(input: MultiModularInput, candidate: LiftCandidate, limits: Limits): Uint8Array {
  const pr = preparedFor(input);
  const Gz = integerCandidatePolys(pr, candidate, limits);
  const S = pr.ring.n + 1;
  let terms = 0;
  for (const g of Gz) terms += g.coeffs.length;
  const text = new TextEncoder().encode(Gz.map((g) => g.coeffs.map((c) => (c < 0n ? "-" + (-c).toString(16) : c.toString(16))).join(",")).join(","));
  const head = new Int32Array(5 + Gz.length + terms * S);
  head.set([INTEGER_CANDIDATE_FORMAT, pr.ring.n, Gz.length, terms, text.byteLength]);
  let at = 5 + Gz.length;
  Gz.forEach((g, i) => {
    head[5 + i] = g.coeffs.length;
    head.set(g.exps.subarray(0, g.coeffs.length * S), at);
    at += g.coeffs.length * S;
  });
  const out = new Uint8Array(head.byteLength + text.byteLength);
  out.set(new Uint8Array(head.buffer), 0);
  out.set(text, head.byteLength);
  return out;
}

/**
 * Makes encodeIntegerCandidate's bytes the integer form of `candidate` in this process, so that
 * proveBatch's pairs, inputs and membership batches use them without the text (`candidate.basis`
 * may then be empty; a batch that needs the text says so). Throws on bytes of another shape.
 */
export function adoptIntegerCandidate(input: MultiModularInput, candidate: LiftCandidate, bytes: Uint8Array): void {
  const pr = preparedFor(input);
  const n = pr.ring.n, S = n + 1;
  const bad = () => new AlgebraError("domain", "multi-modular proof: the candidate's integer form does not match its header or this input");
  if (bytes.byteLength < 20) throw bad();
  const copy = new Uint8Array(bytes.byteLength);
  copy.set(bytes); // aligned, whatever the offset the database driver gave
  const word = new DataView(copy.buffer);
  const [format, nv, elems, terms, textBytes] = [0, 1, 2, 3, 4].map((i) => word.getInt32(4 * i, true));
  const headWords = 5 + elems + terms * S;
  if (format !== INTEGER_CANDIDATE_FORMAT || nv !== n || elems < 1 || terms < elems || copy.byteLength !== 4 * headWords + textBytes) throw bad();
  const head = new Int32Array(copy.buffer, 0, headWords);
  const coeffs = new TextDecoder().decode(copy.subarray(4 * headWords)).split(",");
  if (coeffs.length !== terms) throw bad();
  const Gz: EPoly<bigint>[] = [];
  let at = 5 + elems, t = 0;
  for (let i = 0; i < elems; i++) {
    const len = head[5 + i];
    if (len < 1 || t + len > terms) throw bad();
    const exps = head.slice(at, at + len * S);
    at += len * S;
    const cs = coeffs.slice(t, t + len).map((h) => (h.startsWith("-") ? -BigInt("0x" + h.slice(1)) : BigInt("0x" + h)));
    t += len;
    Gz.push({ coeffs: cs, exps });
  }
  if (t !== terms) throw bad();
  pr.integerCandidates.set(candidate, Gz);
}

/** Proves one batch of proofBatches exactly (see multiModularGroebnerQQ's docblock for why it suffices). */
export function proveBatch(input: MultiModularInput, candidate: LiftCandidate, batch: ProofBatch, limits: Limits): ProofOutcome {
  const pr = preparedFor(input);
  const ring = pr.ring;
  const n = ring.n, cmp = ring.cmp, K = integerCoefficients;
  if (batch.kind === "hilbert") {
    const leads = pr.integerCandidates.get(candidate) ?? candidatePolys(pr, candidate);
    return leadsCovered(leads.map((g) => g.exps), hFreeAt(pr, batch.p, limits)) ? { ok: true } : { ok: false, failed: "hilbert" };
  }
  const Gz = integerCandidatePolys(pr, candidate, limits);
  if (batch.kind === "series") return proveSeriesBatch(pr, candidatePolys(pr, candidate), Gz, batch, limits) ? { ok: true } : { ok: false, failed: "series" };
  if (batch.kind === "pairs") {
    return verifyGroebner(Gz, K, n, cmp, limits, { index: batch.index, of: batch.of }) ? { ok: true } : { ok: false, failed: "groebner" };
  }
  if (batch.kind === "inputs") {
    const rows = new ZeroTest(Gz, K, n, cmp, () => limits.checkTime());
    return pr.integer.every((f) => rows.reducesToZero(f)) ? { ok: true } : { ok: false, failed: "inputs" };
  }
  return pr.reference && allMembers(Gz, pr.reference, limits) ? { ok: true } : { ok: false, failed: "membership" };
}

/**
 * Is `candidate` (for `target`, a lex or block order) the reduced basis of I, given `proven`, a
 * proven reduced basis of I^h in >_h (a `series` input's candidate)? Then LM(I) is generated by
 * the leading monomials of proven(x, 1), so the candidate is it when (i) its leading monomials are
 * the minimal ones among those, (ii) it is reduced (monic; no term below a leading monomial is a
 * multiple of one) and (iii) every element lies in I (reduced to zero by the grevlex reference:
 * proof step 3). (i) and (iii) make it a Gröbner basis of I, (ii) the reduced one, which is unique
 * (Cox, Little, O'Shea, ch. 2 §7, Prop. 6).
 */
export function provesDehomogenised(target: MultiModularInput, candidate: LiftCandidate, series: MultiModularInput, proven: LiftCandidate, limits: Limits): boolean {
  const pr = preparedFor(target);
  const n = pr.ring.n, S = n + 1;
  const H = candidatePolys(preparedFor(series), proven);
  const G = candidatePolys(pr, candidate);
  const key = (e: ArrayLike<number>) => Array.from({ length: n }, (_, k) => e[k + 1]).join(",");
  const hLeads = H.map((h) => { const e = Array.from(h.exps.subarray(0, S + 1)); return [e[0] - e[n + 1], ...e.slice(1, S)]; });
  const want = new Set(hLeads.filter((a) => !hLeads.some((b) => key(b) !== key(a) && dividesPacked(b, a, n))).map(key));
  const gLeads = G.map((g) => g.exps.subarray(0, S));
  if (want.size !== G.length || new Set(gLeads.map(key)).size !== G.length || !gLeads.every((e) => want.has(key(e)))) return false;
  for (const g of G) {
    const c = g.coeffs[0];
    if (c.num !== 1n || c.den !== 1n) return false;
    for (let t = 1; t < g.coeffs.length; t++) {
      if (gLeads.some((e) => dividesPacked(e, g.exps.subarray(t * S, t * S + S), n))) return false;
    }
  }
  return proveBatch(target, candidate, { kind: "membership" }, limits).ok;
}

function dividesPacked(a: ArrayLike<number>, b: ArrayLike<number>, n: number): boolean {
  for (let k = 1; k <= n; k++) if (a[k] > b[k]) return false;
  return true;
}

/** The proven basis as polynomials of the input's ring, sorted by increasing leading monomial. */
export function candidateBasis(input: MultiModularInput, candidate: LiftCandidate): Polynomial<Rational>[] {
  return candidatePolys(preparedFor(input), candidate).slice();
}

/**
 * Bytes of an image for storage: a header (p, n, elements, terms) and the three arrays,
 * little-endian int32. Given `like`, an image of the same input modulo another prime with the same
 * leading monomials and support (lengths and exponents; the usual case among lucky primes), only
 * the residues are written, with `like`'s prime in the header: katsura-8's images go from 1.15 MB
 * to about 0.1 MB, which is what the database, the queue's processes and the coordinator carry.
 */
export function encodeImage(image: ModularImage, like?: ModularImage): Uint8Array {
  const terms = image.coeffs.length;
  const n = image.n | (image.declined ? DECLINED : 0);
  if (like && image.lengths.length > 0 && sameSupport(image, like)) {
    const out = new Int32Array(5 + terms);
    out[0] = image.p; out[1] = n | RESIDUES_ONLY; out[2] = image.lengths.length; out[3] = terms; out[4] = like.p;
    out.set(image.coeffs, 5);
    return new Uint8Array(out.buffer);
  }
  const out = new Int32Array(4 + image.lengths.length + image.exps.length + terms);
  out[0] = image.p; out[1] = n; out[2] = image.lengths.length; out[3] = terms;
  out.set(image.lengths, 4);
  out.set(image.exps, 4 + image.lengths.length);
  out.set(image.coeffs, 4 + image.lengths.length + image.exps.length);
  return new Uint8Array(out.buffer);
}

/**
 * Several images of one input in one piece of bytes (a task that computes a few consecutive
 * primes when each image is quick): word 0 is −1 (a single image starts with its prime, > 0), then
 * the count and each image's length in bytes, then the images, each on the support of the one
 * before it where that matches (the first on `like`'s).
 */
export function encodeImageBatch(images: readonly ModularImage[], like?: ModularImage): Uint8Array {
  const parts: Uint8Array[] = [];
  let prev = like;
  for (const image of images) {
    parts.push(encodeImage(image, prev));
    if (!isDeclinedOnly(image)) prev = image; // the next one is written on the last support computed
  }
  const head = new Int32Array(2 + parts.length);
  head[0] = -1; head[1] = parts.length;
  parts.forEach((b, i) => { head[2 + i] = b.byteLength; });
  const out = new Uint8Array(head.byteLength + parts.reduce((a, b) => a + b.byteLength, 0));
  out.set(new Uint8Array(head.buffer), 0);
  let at = head.byteLength;
  for (const b of parts) { out.set(b, at); at += b.byteLength; }
  return out;
}

/** The images of encodeImageBatch's bytes, or the one image of encodeImage's; `like` as for decodeImage. */
export function decodeImageBatch(bytes: Uint8Array, like?: (p: number) => ModularImage | undefined): ModularImage[] {
  const word = (i: number) => new DataView(bytes.buffer, bytes.byteOffset + 4 * i, 4).getInt32(0, true);
  if (bytes.byteLength < 8 || word(0) !== -1) return [decodeImage(bytes, like)];
  const count = word(1);
  if (count < 0 || bytes.byteLength < 4 * (2 + count)) throw new AlgebraError("domain", "modular images: stored bytes do not match their header");
  const out: ModularImage[] = [];
  let at = 4 * (2 + count);
  for (let i = 0; i < count; i++) {
    const len = word(2 + i);
    if (len < 0 || at + len > bytes.byteLength) throw new AlgebraError("domain", "modular images: stored bytes do not match their header");
    let prev: ModularImage | undefined;
    for (const im of out) if (!isDeclinedOnly(im)) prev = im;
    out.push(decodeImage(bytes.subarray(at, at + len), (q) => (prev && prev.p === q ? prev : like?.(q))));
    at += len;
  }
  return out;
}

/** The prime whose image the first image of a batch (or a single image) refers to, or null. */
export function batchReference(bytes: Uint8Array): number | null {
  const word = (i: number) => new DataView(bytes.buffer, bytes.byteOffset + 4 * i, 4).getInt32(0, true);
  if (bytes.byteLength >= 8 && word(0) === -1) return word(1) === 0 ? null : imageReference(bytes.subarray(4 * (2 + word(1))));
  return imageReference(bytes);
}

/** Header flag (on n) of an image written as residues only, on the support of the image modulo the prime in word 4. */
const RESIDUES_ONLY = 1 << 30;
/** Header flag (on n) of an image flagged `declined`. */
const DECLINED = 1 << 29;

/** Whether two images have the same elements, lengths and exponents (their residues aside). */
export function sameSupport(a: ModularImage, b: ModularImage): boolean {
  if (a.n !== b.n || a.lengths.length !== b.lengths.length || a.exps.length !== b.exps.length) return false;
  for (let i = 0; i < a.lengths.length; i++) if (a.lengths[i] !== b.lengths[i]) return false;
  for (let i = 0; i < a.exps.length; i++) if (a.exps[i] !== b.exps[i]) return false;
  return true;
}

/**
 * The prime whose image a residues-only encoding refers to (decodeImage needs that image), or
 * null for a self-contained encoding.
 */
export function imageReference(bytes: Uint8Array): number | null {
  const head = new Int32Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + 20));
  return (head[1] & RESIDUES_ONLY) !== 0 ? head[4] : null;
}

/**
 * The image from encodeImage's bytes. A residues-only encoding shares the lengths and exponents
 * arrays of `like(prime)` (the same objects, so the lift interns their monomials once).
 */
export function decodeImage(bytes: Uint8Array, like?: (p: number) => ModularImage | undefined): ModularImage {
  const copy = new Uint8Array(bytes.byteLength);
  copy.set(bytes);
  const a = new Int32Array(copy.buffer);
  const declined = a.length >= 2 && (a[1] & DECLINED) !== 0 ? { declined: true } : {};
  if (a.length >= 5 && (a[1] & RESIDUES_ONLY) !== 0) {
    const [p, n, elems, terms, ref] = [a[0], a[1] & ~(RESIDUES_ONLY | DECLINED), a[2], a[3], a[4]];
    const base = like?.(ref);
    if (!base) throw new AlgebraError("domain", `modular image mod ${p}: written on the support of the image mod ${ref}, which is not at hand`);
    if (a.length !== 5 + terms || base.n !== n || base.lengths.length !== elems || base.coeffs.length !== terms) {
      throw new AlgebraError("domain", "modular image: stored bytes do not match their header");
    }
    return { p, n, lengths: base.lengths, exps: base.exps, coeffs: a.slice(5), ...declined };
  }
  const [p, n, elems, terms] = [a[0], a[1] & ~DECLINED, a[2], a[3]];
  if (a.length !== 4 + elems + terms * (n + 1) + terms) throw new AlgebraError("domain", "modular image: stored bytes do not match their header");
  const lengths = a.slice(4, 4 + elems);
  const exps = a.slice(4 + elems, 4 + elems + terms * (n + 1));
  const coeffs = a.slice(4 + elems + terms * (n + 1));
  return { p, n, lengths, exps, coeffs, ...declined };
}

/**
 * Reduced Gröbner basis over Q by multi-modular F4 (Arnold, "Modular algorithms for computing
 * Gröbner bases", J. Symbolic Comput. 35, 2003; Idrees, Pfister and Steidel, "Parallelization of
 * modular algorithms", J. Symbolic Comput. 46, 2011): the reduced basis modulo primes p < 2^21 by
 * F4 (f4.ts); primes whose leading-monomial set is not the most frequent one are unlucky and set
 * aside; the coefficients of the others are combined by the Chinese remainder theorem and lifted
 * to Q by maximal-quotient rational reconstruction (reconstruction.ts); the lift counts once it
 * agrees with the basis modulo a fresh prime. Then it is **proven**, exactly:
 *  1. G is a Gröbner basis: Buchberger's criterion with the Gebauer–Möller (chain) criteria,
 *     every remaining S-polynomial top-reduces to zero over Z (groebner/verify.ts);
 *  2. ⟨F⟩ ⊆ ⟨G⟩: every input reduces to zero modulo G;
 *  3. ⟨G⟩ ⊆ ⟨F⟩, by Hilbert functions (graded orders): for the homogenised inputs F^h in
 *     Q[x, h] (degree, then the ring's order on the x-part: grevlex with h last for grevlex) and every degree d, dim_Q ⟨F^h⟩_d ≥ dim_{Z/p} ⟨F^h mod p⟩_d, since
 *     the degree-d Macaulay matrix has integer entries and its rank can only drop modulo p; the
 *     latter is the number of degree-d monomials in LM(⟨F^h mod p⟩), computed by one more F4 run
 *     modulo p. If every LM(g), g ∈ G, is a multiple of an h-free leading monomial of that basis,
 *     this number is at least #{monomials of degree ≤ d in ⟨LM(G)⟩} = dim ⟨G⟩_{≤d} (G a Gröbner
 *     basis in a degree-compatible order). Dehomogenising maps ⟨F^h⟩_d injectively into
 *     ⟨F⟩_{≤d}, so dim ⟨F⟩_{≤d} ≥ dim ⟨G⟩_{≤d}; with ⟨F⟩ ⊆ ⟨G⟩ (step 2) both are equal for
 *     every d, hence ⟨F⟩ = ⟨G⟩. (The homogeneous case of this argument is Arnold 2003, Thm. 5.6 —
 *     theorem number recalled from memory; the inhomogeneous extension is worked out here.)
 *     For lex and block orders, given `reference` (a proven Gröbner basis R of ⟨F⟩ in grevlex):
 *     every g ∈ G reduces to zero modulo R, i.e. g ∈ ⟨R⟩ = ⟨F⟩ (Cox, Little, O'Shea, ch. 2 §6,
 *     Corollary 2: the remainder on division by a Gröbner basis decides membership).
 * With `series` (lex and block orders through I^h, f4/distribution.ts `seriesRoute`) steps 1–3
 * are replaced by the Hilbert-series proof of proveSeriesBatch, which forms no S-polynomial.
 * Returns null when a step cannot be completed (the caller then uses the traced Buchberger path,
 * which is proven by construction); `stats.failed` says which.
 *
 * Example: katsura-7 (8 variables, grevlex, 74 elements) lifts from 18 primes below 2^21; cyclic-5
 * declines at step 3 (its homogenised ideal is not saturated).
 */
export function multiModularGroebnerQQ(
  polys: readonly Polynomial<Rational>[],
  limits: Limits,
  options: MultiModularOptions = {},
): Polynomial<Rational>[] | null {
  const stats: MultiModularStats = options.stats ?? { primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 };
  const maxPrimes = options.maxPrimes ?? 1000;
  const input = multiModularInput(polys, options.reference, options.primeLimit, options.series === true);
  if (!canLift(input)) return null;
  if (options.hFreeLeads) preparedFor(input).hFree.set(options.hFreeLeads.p, { n: polys[0].ring.n, leads: [...options.hFreeLeads.leads] });
  const graded = isGradedOrder(polys[0].ring as Polynomial<unknown>["ring"]);
  const f4stats: F4Stats = { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 };
  const lifter = new ImageLifter(input, () => limits.checkTime());
  // Declines set aside as the lift allows: a distributed run of the same input sets aside the same primes.
  const tracing: ImageTracing | undefined = options.traced === false ? undefined : { trace: undefined, replayed: 0, declined: 0, onDecline: () => lifter.takesDecline() };
  const result = lift();
  if (options.replays && tracing) { options.replays.replayed += tracing.replayed; options.replays.declined += tracing.declined; }
  const proofFailed = stats.failed === "groebner" || stats.failed === "inputs" || stats.failed === "membership" || stats.failed === "series";
  if (result === null && tracing && tracing.replayed > 0 && proofFailed) {
    // A replay can miss a row that reduces to zero only at the learning prime; the plain run cannot.
    // (Out of primes, the caller's fallback answers instead: a rerun would double a hopeless run.)
    return multiModularGroebnerQQ(polys, limits, { ...options, stats, traced: false });
  }
  return result;

  function lift(): Polynomial<Rational>[] | null {
    let candidate: LiftCandidate | null = null;
    let k = 0;
    for (const p of liftPrimes(input)) {
      if (k >= maxPrimes) { stats.failed = "primes"; return null; }
      limits.checkTime();
      k++;
      stats.primes = k;
      const t0 = Date.now();
      const image = imageModPrime(input, p, limits, { k, of: maxPrimes }, f4stats, tracing);
      stats.modularMs += Date.now() - t0;
      if (graded && k === 1) {
        // Step 3 first, as it needs only residues: when it cannot succeed, do not lift at all.
        const th = Date.now();
        const covered = leadsOfImageCovered(input, image, limits);
        stats.proofMs += Date.now() - th;
        if (!covered) { stats.failed = "hilbert"; return null; }
      }
      candidate = lifter.add(image);
      stats.unlucky = lifter.unlucky;
      if (candidate) break;
      const early = options.proveEarly && k <= EARLY_PROOF_PRIMES ? lifter.reconstructed() : null;
      if (early) {
        if (prove(early)) { stats.liftMs += lifter.liftMs; return candidateBasis(input, early); }
        lifter.reject(); // reconstructed from too few primes
        stats.failed = undefined;
      }
    }
    stats.liftMs += lifter.liftMs;
    if (!candidate) return null;
    return prove(candidate) ? candidateBasis(input, candidate) : null;
  }

  function prove(cand: LiftCandidate): boolean {
    const t2 = Date.now();
    try {
      for (const batch of proofBatches(input, cand)) {
        const tb = Date.now();
        const outcome = proveBatch(input, cand, batch, limits);
        if (batch.kind === "pairs") stats.criterionMs = (stats.criterionMs ?? 0) + Date.now() - tb;
        if (!outcome.ok) { stats.failed = outcome.failed; return false; }
      }
      return true;
    } finally {
      stats.proofMs += Date.now() - t2;
    }
  }
}

/**
 * The early step-3 check on an image (graded orders; true otherwise): are its leading monomials
 * covered by the h-free leads at its prime? When not, the proof cannot succeed, so do not lift.
 */
export function imagePassesHilbert(input: MultiModularInput, image: ModularImage, limits: Limits): boolean {
  return !preparedFor(input).graded || leadsOfImageCovered(input, image, limits);
}

/**
 * A stand-in candidate made of the image's leading monomials only: enough for the step-3 batch
 * `{ kind: "hilbert", p: image.p }`, which looks at leading monomials alone, so that this early
 * check (proven impossible = do not lift) can run on another machine.
 */
export function leadsCandidate(input: MultiModularInput, image: ModularImage): LiftCandidate {
  const ring = preparedFor(input).ring;
  const S = image.n + 1;
  const basis: string[] = [];
  let t = 0;
  for (let e = 0; e < image.lengths.length; e++) {
    basis.push(ring.format(normalizeTerms(ring, [QQ.one], image.exps.slice(t * S, t * S + S))));
    t += image.lengths[e];
  }
  return { basis, primes: [], unlucky: [], checkedWith: image.p };
}

function leadsOfImageCovered(input: MultiModularInput, image: ModularImage, limits: Limits): boolean {
  const h = hFreeAt(preparedFor(input), image.p, limits);
  const S = image.n + 1;
  const leads: Int32Array[] = [];
  let t = 0;
  for (let e = 0; e < image.lengths.length; e++) {
    leads.push(image.exps.subarray(t * S, t * S + S));
    t += image.lengths[e];
  }
  return leadsCovered(leads, h);
}

function dropZeros(mons: Int32Array, coeffs: Int32Array): F4Poly {
  let nz = 0;
  for (let t = 0; t < coeffs.length; t++) if (coeffs[t] !== 0) nz++;
  if (nz === coeffs.length) return { mons, coeffs };
  const m = new Int32Array(nz), c = new Int32Array(nz);
  for (let t = 0, k = 0; t < coeffs.length; t++) if (coeffs[t] !== 0) { m[k] = mons[t]; c[k] = coeffs[t]; k++; }
  return { mons: m, coeffs: c };
}

/** Adds the residues of G mod p to the group's lifted coefficients (CRT). */
function combine(group: Group, Gp: readonly F4Poly[], p: number): void {
  const M = group.M, P = BigInt(p);
  const mInv = group.count === 0 ? 0 : invModP(Number(M % P), p);
  Gp.forEach((g, e) => {
    const L = group.elems[e];
    let idx: Int32Array, covers: boolean;
    if (L.lastMons === g.mons && L.lastIdx && L.lastCovers !== undefined && L.lastIdx.length === g.mons.length) {
      idx = L.lastIdx;
      covers = L.lastCovers;
    } else {
      idx = new Int32Array(g.mons.length);
      for (let t = 0; t < g.mons.length; t++) {
        const m = g.mons[t];
        let i = L.index.get(m);
        if (i === undefined) { i = L.mons.length; L.index.set(m, i); L.mons.push(m); L.vals.push(0n); L.sure.push(false); }
        idx[t] = i;
      }
      covers = new Set(idx).size === L.mons.length;
      L.lastMons = g.mons; L.lastIdx = idx; L.lastCovers = covers;
    }
    const step = (i: number, residue: number) => {
      L.vals[i] = group.count === 0 ? BigInt(residue) : crtStep(L.vals[i], M, residue, p, mInv, P);
      const r = L.rats[i];
      if (L.sure[i] && r) L.sure[i] = agreesWithResidue(r, residue, p, P);
    };
    if (covers) {
      for (let t = 0; t < idx.length; t++) step(idx[t], g.coeffs[t]);
    } else {
      const residues = new Float64Array(L.mons.length); // the image's coefficient, 0 where it has no term
      for (let t = 0; t < idx.length; t++) residues[idx[t]] = g.coeffs[t];
      for (let i = 0; i < L.mons.length; i++) step(i, residues[i]);
    }
  });
  group.M = M * BigInt(p);
  group.count++;
}

function reconstruct(group: Group, tick: () => void): { mons: number[]; coeffs: Rational[] }[] | null {
  const M = group.M, logm = bitLength(M);
  if (logm < group.retryBits) return null;
  const [fe, ft] = group.failedAt;
  const first = group.elems[fe]?.vals[ft];
  if (first !== undefined && guidedReconstruction(first, M, logm, group.elems[fe].rats[ft], 0n) === null) {
    group.retryBits = Math.floor(logm * RETRY_GROWTH);
    return null;
  }
  const out: { mons: number[]; coeffs: Rational[] }[] = [];
  for (let e = 0; e < group.elems.length; e++) {
    const L = group.elems[e];
    const coeffs: Rational[] = [];
    const mons: number[] = [];
    // The element's denominators so far (lcm), a guess for the next coefficient's.
    let den = 1n;
    for (let i = 0; i < L.vals.length; i++) {
      if ((i & 255) === 0) tick();
      const prev = L.rats[i];
      // Still ≡ vals[i] mod M (combine checked it prime by prime): what guidedReconstruction would return.
      const r = L.sure[i] && prev && prev.num !== 0n ? prev : guidedReconstruction(L.vals[i], M, logm, prev, den);
      if (r === null) { group.failedAt = [e, i]; group.retryBits = Math.floor(logm * RETRY_GROWTH); return null; }
      if (r !== prev || !L.sure[i]) L.sure[i] = r.num !== 0n && (r.num - L.vals[i] * r.den) % M === 0n;
      L.rats[i] = r;
      if (r.num === 0n) continue;
      if (den % r.den !== 0n) den = (den / gcdBig(den, r.den)) * r.den;
      coeffs.push(r);
      mons.push(L.mons[i]);
    }
    out.push({ mons, coeffs });
  }
  return out;
}

/** Whether n/d ≡ residue (mod p), as n ≡ residue·d: a product below 2^52, exact in a double. */
function agreesWithResidue(r: Rational, residue: number, p: number, P: bigint): boolean {
  let n = Number(r.num % P);
  if (n < 0) n += p;
  return n === (residue * Number(r.den % P)) % p;
}

function agreesModP(cand: readonly { mons: number[]; coeffs: Rational[] }[], Gp: readonly F4Poly[], p: number): boolean {
  if (cand.length !== Gp.length) return false;
  const P = BigInt(p);
  for (let e = 0; e < Gp.length; e++) {
    const g = Gp[e], c = cand[e];
    const got = new Map<number, number>();
    for (let t = 0; t < c.mons.length; t++) {
      const v = rationalModP(c.coeffs[t], p, P);
      if (v === null) return false;
      if (v !== 0) got.set(c.mons[t], v);
    }
    if (got.size !== g.mons.length) return false;
    for (let t = 0; t < g.mons.length; t++) if (got.get(g.mons[t]) !== g.coeffs[t]) return false;
  }
  return true;
}

/**
 * The Hilbert-series proof for a `series` input (I^h generated by the input, R = `reference` a
 * proven grevlex basis of I, h the last variable, the order >_h): a candidate G is the reduced
 * basis of I^h when
 *  (a) every g ∈ G is homogeneous and g(x, 1) ∈ I — then g = h^k·(g(x, 1))^h ∈ I^h (Cox, Little,
 *      O'Shea, 4th ed. 2015, ch. 8 §4: I^h is spanned by the f^h, f ∈ I; recalled from memory);
 *      g(x, 1) ∈ I is decided by its remainder modulo R (ch. 2 §6, Corollary 2);
 *  (b) HS(Q[x,h]/⟨LM(G)⟩) = HS(Q[x,h]/I^h). By (a), ⟨LM(G)⟩ ⊆ LM(I^h), and monomial ideals one
 *      inside the other with equal Hilbert series are equal, so G is a Gröbner basis of I^h.
 *      The right side is known exactly: R^h is a Gröbner basis of I^h in grevlex with h last
 *      (ch. 8 §4, Theorem 4) with LM(r^h) = LM(r), so LM(I^h) = ⟨LM(R)⟩ in Q[x, h]
 *      (hilbert-series.ts computes both numerators).
 * No S-polynomial is formed. Batch `index` of `of` checks (a) for the elements index mod of, and
 * batch 0 also (b) and the homogeneity.
 */
function proveSeriesBatch(pr: Prepared, G: readonly Polynomial<Rational>[], Gz: readonly EPoly<bigint>[], batch: { index: number; of: number }, limits: Limits): boolean {
  const n = pr.ring.n, S = n + 1;
  const reference = pr.reference;
  if (!reference) return false;
  if (batch.index === 0) {
    for (const g of G) {
      for (let t = 1; t < g.coeffs.length; t++) if (g.exps[t * S] !== g.exps[0]) return false;
    }
    const leads = (polys: readonly Polynomial<Rational>[]) => polys.filter((g) => g.coeffs.length > 0).map((g) => Array.from(g.exps.subarray(1, S)));
    const tick = () => limits.checkTime();
    if (!sameNumerator(hilbertNumerator(leads(G), n, tick), hilbertNumerator(leads(reference), n, tick))) return false;
  }
  // g(x, 1): h's exponent to 0 (terms of a homogeneous g keep distinct x-parts).
  const mine = Gz.filter((_, e) => e % batch.of === batch.index).map((g) => {
    const exps = Int32Array.from(g.exps);
    for (let t = 0; t < g.coeffs.length; t++) {
      exps[t * S] -= exps[t * S + n];
      exps[t * S + n] = 0;
    }
    return { coeffs: g.coeffs, exps };
  });
  return allMembers(mine, reference, limits);
}

function hasLast(r: Polynomial<Rational>): boolean {
  const S = r.ring.n + 1;
  for (let t = 0; t < r.coeffs.length; t++) if (r.exps[t * S + r.ring.n] !== 0) return true;
  return false;
}

/** Does every polynomial of `polys` (engine form, this ring's order) lie in the ideal of the Gröbner basis `reference`? */
function allMembers(polys: readonly EPoly<bigint>[], reference: readonly Polynomial<Rational>[], limits: Limits): boolean {
  const refRing = reference[0].ring;
  const n = refRing.n, K = integerCoefficients;
  const reducers = reference.map((r) => {
    const z = clearDenominators(toEngine(r));
    K.normalize(z.coeffs, () => limits.checkTime());
    return z;
  });
  // ZeroTest sorts the terms in the reference's order itself.
  const rows = new ZeroTest(reducers, K, n, refRing.cmp, () => limits.checkTime());
  return polys.every((g) => rows.reducesToZero(g));
}

/** The h-free leading monomials of the reduced basis of F^h mod p (grevlex, h last), as packed x-monomials. */
interface HFreeLeads {
  readonly n: number;
  readonly leads: Int32Array[];
}

/** Step 3: is every leading monomial (packed, at offset 0) a multiple of an h-free leading monomial? */
function leadsCovered(lms: readonly Int32Array[], h: HFreeLeads): boolean {
  const n = h.n;
  return lms.every((lm) => h.leads.some((m) => {
    for (let k = 1; k <= n; k++) if (m[k] > lm[k]) return false;
    return true;
  }));
}

function homogenisedLeads(integer: readonly EPoly<bigint>[], p: number, grlex: boolean, limits: Limits): HFreeLeads {
  const n = (integer[0].exps.length / integer[0].coeffs.length) - 1;
  const S = n + 1, Sh = n + 2;
  const T = new MonomialTable(n + 1);
  const P = BigInt(p);
  const e = new Int32Array(Sh);
  const homog: F4Poly[] = [];
  for (const f of integer) {
    let D = 0;
    for (let t = 0; t < f.coeffs.length; t++) D = Math.max(D, f.exps[t * S]);
    const mons: number[] = [], coeffs: number[] = [];
    for (let t = 0; t < f.coeffs.length; t++) {
      let c = Number(f.coeffs[t] % P);
      if (c < 0) c += p;
      if (c === 0) continue;
      for (let k = 0; k < S; k++) e[k] = f.exps[t * S + k];
      e[0] = D;
      e[n + 1] = D - f.exps[t * S];
      mons.push(T.intern(e, 0));
      coeffs.push(c);
    }
    if (mons.length === 0) continue;
    // Terms are re-sorted below in the homogenised order.
    homog.push({ mons: Int32Array.from(mons), coeffs: Int32Array.from(coeffs) });
  }
  // The homogenised order: degree, then the ring's order on the x-part (for grevlex this is grevlex with h last).
  const cmpH: MonomialComparator = grlex
    ? (a, ia, b, ib) => {
      const dd = a[ia] - b[ib];
      if (dd !== 0) return dd;
      const dx = (a[ia] - a[ia + n + 1]) - (b[ib] - b[ib + n + 1]);
      if (dx !== 0) return dx;
      for (let k = 1; k <= n; k++) if (a[ia + k] !== b[ib + k]) return a[ia + k] - b[ib + k];
      return 0;
    }
    : makeComparator([{ kind: "grevlex" }], n + 1);
  const mcmp = T.comparator(cmpH);
  for (const f of homog) {
    const order = Array.from(f.mons.keys()).sort((a, b) => mcmp(f.mons[b], f.mons[a]));
    const mons = order.map((i) => f.mons[i]), coeffs = order.map((i) => f.coeffs[i]);
    (f as { mons: Int32Array }).mons = Int32Array.from(mons);
    (f as { coeffs: Int32Array }).coeffs = Int32Array.from(coeffs);
  }
  const H = f4ModP(homog, T, p, cmpH, { limits });
  const leads = H.map((h) => h.mons[0]).filter((m) => T.exps[m * Sh + n + 1] === 0).map((m) => T.exps.slice(m * Sh, m * Sh + S));
  return { n, leads };
}
