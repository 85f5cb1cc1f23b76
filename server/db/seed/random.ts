/**
 * A small seeded random source for the demo generator. Every stream is named, so changing one
 * grower's story does not shift the numbers drawn for anyone else.
 */
import seedrandom from 'seedrandom';

/** The root seed of the whole demo season. Change it and every generated number changes. */
export const DEMO_SEED = 'saltbush-bend-2026';

export class Rng {
  private readonly next: () => number;

  constructor(name: string) {
    this.next = seedrandom(`${DEMO_SEED}:${name}`);
  }

  /** Uniform in [0, 1). */
  float(): number {
    return this.next();
  }

  uniform(min: number, max: number): number {
    return min + (max - min) * this.next();
  }

  /** Whole number from min to max inclusive. */
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }

  chance(p: number): boolean {
    return this.next() < p;
  }

  /** Normal deviate (Box-Muller). */
  normal(mean = 0, sd = 1): number {
    const u = 1 - this.next();
    const v = this.next();
    return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  /** A multiplicative noise factor around 1 that never goes below 0.05. */
  factor(sd: number): number {
    return Math.max(0.05, this.normal(1, sd));
  }

  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)]!;
  }

  /** Picks one of `items` with the given relative weights. */
  weighted<T>(items: readonly T[], weights: readonly number[]): T {
    const total = weights.reduce((s, w) => s + w, 0);
    let r = this.next() * total;
    for (let i = 0; i < items.length; i++) {
      r -= weights[i]!;
      if (r < 0) return items[i]!;
    }
    return items[items.length - 1]!;
  }
}

export function roundTo(value: number, step: number): number {
  return Math.round(value / step) * step;
}

/** Rounds to a number of decimals without binary noise (0.30000000000000004). */
export function round(value: number, decimals: number): number {
  return Number(value.toFixed(decimals));
}

export function clamp(value: number, min: number, max: number): number {
  return Math.min(max, Math.max(min, value));
}
