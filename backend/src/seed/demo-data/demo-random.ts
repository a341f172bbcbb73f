/**
 * The demo data's own seeded generator, so the same seed gives the same files byte for byte:
 * splitmix32 to spread the seed, then sfc32 (Chris Doty-Humphrey's small fast counter generator,
 * public domain, as widely reproduced). Not for cryptography.
 */
export class DemoRandom {
  private a: number;
  private b: number;
  private c: number;
  private d: number;
  private spare = Number.NaN;

  constructor(seed: number) {
    let s = seed >>> 0;
    const splitmix = () => {
      s = (s + 0x9e3779b9) >>> 0;
      let z = s;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
      return (z ^ (z >>> 16)) >>> 0;
    };
    this.a = splitmix();
    this.b = splitmix();
    this.c = splitmix();
    this.d = splitmix();
    for (let i = 0; i < 12; i++) this.next();
  }

  /** Uniform in [0, 1). */
  next(): number {
    const t = (((this.a + this.b) >>> 0) + this.d) >>> 0;
    this.d = (this.d + 1) >>> 0;
    this.a = this.b ^ (this.b >>> 9);
    this.b = (this.c + (this.c << 3)) >>> 0;
    this.c = ((this.c << 21) | (this.c >>> 11)) >>> 0;
    this.c = (this.c + t) >>> 0;
    return t / 4294967296;
  }

  uniform(lo: number, hi: number): number {
    return lo + (hi - lo) * this.next();
  }

  integer(lo: number, hi: number): number {
    return lo + Math.floor(this.next() * (hi - lo + 1));
  }

  /** Standard normal (Marsaglia polar method). */
  normal(mean = 0, sd = 1): number {
    if (!Number.isNaN(this.spare)) {
      const z = this.spare;
      this.spare = Number.NaN;
      return mean + sd * z;
    }
    let u: number, v: number, s: number;
    do {
      u = 2 * this.next() - 1;
      v = 2 * this.next() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const f = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * f;
    return mean + sd * u * f;
  }
}

/** A 32-bit seed from text (FNV-1a), so each unit gets its own stream from one scenario seed. */
export function seedFromText(text: string, seed: number): number {
  let h = (0x811c9dc5 ^ seed) >>> 0;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193) >>> 0;
  return h;
}
