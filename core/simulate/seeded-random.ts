/**
 * The simulator's deterministic random numbers: xoshiro128** 1.1 (Blackman & Vigna, "Scrambled
 * linear pseudorandom number generators", ACM TOMS 47, 2021; 128-bit state, period 2¹²⁸ − 1),
 * seeded through splitmix32 (a 32-bit variant of Steele, Lea & Flood's SplitMix, with
 * the finaliser of MurmurHash3) so that any integer seed gives a well-mixed, non-zero state.
 *
 * Independent streams (`fork`) are keyed by a name, so that e.g. adding a star does not change
 * the weather: each part of the simulation draws from its own stream. Never uses Math.random.
 */
export class SeededRandom {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spareGaussian: number | null = null;
  /** The 32-bit seed this stream was built from (for `fork`). */
  readonly seed: number;

  constructor(seed: number) {
    if (!Number.isSafeInteger(seed)) throw new RangeError(`SeededRandom: the seed must be an integer (got ${seed})`);
    this.seed = (seed % 4294967296) >>> 0;
    let state = this.seed;
    const next = (): number => {
      state = (state + 0x9e3779b9) >>> 0;
      let z = state;
      z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
      z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
      return (z ^ (z >>> 16)) >>> 0;
    };
    this.s0 = next();
    this.s1 = next();
    this.s2 = next();
    this.s3 = next();
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1;
  }

  /**
   * A stream started from an explicit xoshiro128** state (four 32-bit words, not all zero), for
   * checking the generator against the published reference code.
   */
  static fromState(state: readonly [number, number, number, number]): SeededRandom {
    if (state.every((word) => word >>> 0 === 0)) throw new RangeError('SeededRandom.fromState: the state must not be all zero');
    const random = new SeededRandom(0);
    [random.s0, random.s1, random.s2, random.s3] = state.map((word) => word >>> 0);
    return random;
  }

  /** A new stream for the part of the simulation called `name`, independent of this one's draws. */
  fork(name: string): SeededRandom {
    let hash = 0x811c9dc5; // FNV-1a over the name's UTF-16 code units, mixed with this seed
    for (let i = 0; i < name.length; i++) hash = Math.imul(hash ^ name.charCodeAt(i), 0x01000193);
    return new SeededRandom((hash ^ Math.imul(this.seed, 0x9e3779b1)) >>> 0);
  }

  /** The next 32-bit unsigned integer (xoshiro128**). */
  nextUint32(): number {
    const result = Math.imul(rotateLeft(Math.imul(this.s1, 5), 7), 9) >>> 0;
    const t = this.s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotateLeft(this.s3, 11);
    return result;
  }

  /** Uniform in [0, 1) with 53 random bits. */
  uniform(): number {
    const high = this.nextUint32() >>> 5; // 27 bits
    const low = this.nextUint32() >>> 6; // 26 bits
    return (high * 67108864 + low) / 9007199254740992;
  }

  /** Uniform in [low, high). */
  between(low: number, high: number): number {
    return low + (high - low) * this.uniform();
  }

  /** An integer in [0, count). */
  integer(count: number): number {
    if (!(Number.isInteger(count) && count > 0)) throw new RangeError(`SeededRandom.integer: count must be a positive integer (got ${count})`);
    return Math.floor(this.uniform() * count);
  }

  /** True with probability `probability`. */
  chance(probability: number): boolean {
    return this.uniform() < probability;
  }

  /**
   * A standard normal deviate by Marsaglia's polar method (Marsaglia & Bray 1964); the second
   * deviate of each pair is kept for the next call.
   */
  gaussian(): number {
    if (this.spareGaussian !== null) {
      const spare = this.spareGaussian;
      this.spareGaussian = null;
      return spare;
    }
    let u: number, v: number, s: number;
    do {
      u = 2 * this.uniform() - 1;
      v = 2 * this.uniform() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const factor = Math.sqrt((-2 * Math.log(s)) / s);
    this.spareGaussian = v * factor;
    return u * factor;
  }

  /** A normal deviate with the given mean and standard deviation. */
  normal(mean: number, sigma: number): number {
    return mean + sigma * this.gaussian();
  }
}

function rotateLeft(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
