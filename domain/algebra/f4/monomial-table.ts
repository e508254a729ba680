import type { MonomialComparator } from "../order";

/**
 * Interned monomials for F4 (Faugère, J. Pure Appl. Algebra 139, 1999, §2: "the monomials are
 * stored once"; the layout follows common practice in F4 implementations). Each monomial gets a
 * small integer id; its packed exponent vector `[degree, e_1..e_n]` (the ring's own layout, so the
 * ring's comparator works on it directly), a 32-bit divisibility mask (bit k mod 32 set when
 * x_k occurs: a | b implies mask(a) & ~mask(b) = 0) and a hash that is *linear* in the exponents,
 * so hash(a·b) = hash(a) + hash(b) and a product is found without hashing its exponents.
 * Open addressing with linear probing; the table doubles at half load.
 *
 * Example (n = 2): intern([3, 2, 1]) (x^2*y) gives an id i; product(i, id of y) is the id of x^2*y^2.
 */
export class MonomialTable {
  readonly S: number;
  exps: Int32Array;
  masks: Int32Array;
  hashes: Uint32Array;
  size = 0;
  private slots: Int32Array;
  private readonly weights: Uint32Array;
  private readonly tmp: Int32Array;

  constructor(readonly n: number, capacity = 1 << 12) {
    this.S = n + 1;
    this.exps = new Int32Array(capacity * this.S);
    this.masks = new Int32Array(capacity);
    this.hashes = new Uint32Array(capacity);
    this.slots = new Int32Array(capacity * 2).fill(-1);
    this.weights = new Uint32Array(this.S);
    // Fixed pseudo-random odd weights (xorshift), so runs are reproducible.
    let s = 0x9e3779b9 >>> 0;
    for (let k = 1; k <= n; k++) {
      s ^= s << 13; s >>>= 0; s ^= s >>> 17; s ^= s << 5; s >>>= 0;
      this.weights[k] = (s | 1) >>> 0;
    }
    this.tmp = new Int32Array(this.S);
  }

  /** Id of the packed monomial at e[off..off+n] (degree slot included). */
  intern(e: Int32Array, off: number): number {
    const S = this.S;
    let h = 0;
    for (let k = 1; k < S; k++) h = (h + Math.imul(this.weights[k], e[off + k])) >>> 0;
    return this.find(e, off, h);
  }

  /** Id of a·b. */
  product(a: number, b: number): number {
    const S = this.S, E = this.exps, t = this.tmp;
    const ia = a * S, ib = b * S;
    for (let k = 0; k < S; k++) t[k] = E[ia + k] + E[ib + k];
    return this.find(t, 0, (this.hashes[a] + this.hashes[b]) >>> 0);
  }

  /** Id of a/b; b must divide a. */
  quotient(a: number, b: number): number {
    const S = this.S, E = this.exps, t = this.tmp;
    const ia = a * S, ib = b * S;
    for (let k = 0; k < S; k++) t[k] = E[ia + k] - E[ib + k];
    return this.find(t, 0, (this.hashes[a] - this.hashes[b]) >>> 0);
  }

  lcm(a: number, b: number): number {
    const S = this.S, E = this.exps, t = this.tmp;
    const ia = a * S, ib = b * S;
    let d = 0;
    for (let k = 1; k < S; k++) {
      const x = E[ia + k], y = E[ib + k];
      t[k] = x > y ? x : y;
      d += t[k];
    }
    t[0] = d;
    return this.intern(t, 0);
  }

  /** Does monomial a divide monomial b? */
  divides(a: number, b: number): boolean {
    if ((this.masks[a] & ~this.masks[b]) !== 0) return false;
    const S = this.S, E = this.exps, ia = a * S, ib = b * S;
    if (E[ia] > E[ib]) return false;
    for (let k = 1; k < S; k++) if (E[ia + k] > E[ib + k]) return false;
    return true;
  }

  coprime(a: number, b: number): boolean {
    if ((this.masks[a] & this.masks[b]) === 0) return true;
    const S = this.S, E = this.exps, ia = a * S, ib = b * S;
    for (let k = 1; k < S; k++) if (E[ia + k] !== 0 && E[ib + k] !== 0) return false;
    return true;
  }

  degree(a: number): number {
    return this.exps[a * this.S];
  }

  /** Comparator on ids through the ring's comparator on packed exponents. */
  comparator(cmp: MonomialComparator): (a: number, b: number) => number {
    return (a, b) => cmp(this.exps, a * this.S, this.exps, b * this.S);
  }

  /** Packed exponents of a list of ids, one after the other (the ring's polynomial layout). */
  packed(ids: ArrayLike<number>): Int32Array {
    const S = this.S, out = new Int32Array(ids.length * S);
    for (let t = 0; t < ids.length; t++) out.set(this.exps.subarray(ids[t] * S, ids[t] * S + S), t * S);
    return out;
  }

  private find(e: Int32Array, off: number, h: number): number {
    const S = this.S;
    const mask = this.slots.length - 1;
    let pos = h & mask;
    for (;;) {
      const id = this.slots[pos];
      if (id < 0) break;
      if (this.hashes[id] === h) {
        const base = id * S;
        let same = true;
        for (let k = 1; k < S; k++) if (this.exps[base + k] !== e[off + k]) { same = false; break; }
        if (same) return id;
      }
      pos = (pos + 1) & mask;
    }
    // Insert.
    if (this.size * S >= this.exps.length) this.growStore();
    const id = this.size++;
    const base = id * S;
    let d = 0, m = 0;
    for (let k = 1; k < S; k++) {
      const x = e[off + k];
      this.exps[base + k] = x;
      d += x;
      if (x !== 0) m |= 1 << ((k - 1) & 31);
    }
    this.exps[base] = d;
    this.masks[id] = m;
    this.hashes[id] = h;
    if (this.size * 2 > this.slots.length) {
      this.rehash();
    } else {
      this.slots[pos] = id;
    }
    return id;
  }

  private growStore(): void {
    const cap = this.masks.length * 2;
    const e = new Int32Array(cap * this.S); e.set(this.exps); this.exps = e;
    const m = new Int32Array(cap); m.set(this.masks); this.masks = m;
    const h = new Uint32Array(cap); h.set(this.hashes); this.hashes = h;
  }

  private rehash(): void {
    const slots = new Int32Array(this.slots.length * 2).fill(-1);
    const mask = slots.length - 1;
    for (let id = 0; id < this.size; id++) {
      let pos = this.hashes[id] & mask;
      while (slots[pos] >= 0) pos = (pos + 1) & mask;
      slots[pos] = id;
    }
    this.slots = slots;
  }
}
