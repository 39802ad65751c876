// Small seeded pseudo-random generator (mulberry32) so every synthetic set is reproducible from its seed.

export class Prng {
  private state: number;

  constructor(seed: number) {
    // Mixing the seed once keeps neighbouring seeds (1, 2, 3 …) from starting on similar sequences.
    this.state = Math.imul(seed ^ 0x9e3779b9, 0x85ebca6b) >>> 0;
  }

  /** Uniform in [0, 1). */
  next(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  uniform(min: number, max: number): number {
    return min + (max - min) * this.next();
  }

  /** Standard normal by the Box–Muller transform. */
  normal(mean = 0, sd = 1): number {
    const u = 1 - this.next();
    const v = this.next();
    return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  chance(probability: number): boolean {
    return this.next() < probability;
  }

  int(min: number, maxInclusive: number): number {
    return min + Math.floor(this.next() * (maxInclusive - min + 1));
  }

  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)];
  }
}
