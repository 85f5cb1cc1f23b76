/**
 * Invented names for the benchmark scenario: people, gardens and places are made up by
 * combining syllables, so no real person or place is described.
 */
import seedrandom from 'seedrandom';

export const BENCH_SEED = 'seepwise-bench-v1';

export class BenchRng {
  private readonly next: () => number;
  constructor(name: string) {
    this.next = seedrandom(`${BENCH_SEED}:${name}`);
  }
  float(): number {
    return this.next();
  }
  uniform(min: number, max: number): number {
    return min + (max - min) * this.next();
  }
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }
  chance(p: number): boolean {
    return this.next() < p;
  }
  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)]!;
  }
  weighted<T>(items: readonly T[], weights: readonly number[]): T {
    const total = weights.reduce((s, w) => s + w, 0);
    let r = this.next() * total;
    for (let i = 0; i < items.length; i++) {
      r -= weights[i]!;
      if (r < 0) return items[i]!;
    }
    return items[items.length - 1]!;
  }
  /** A version-4-shaped UUID from this stream, so the scenario is the same on every run. */
  uuid(): string {
    const b: number[] = [];
    for (let i = 0; i < 16; i++) b.push(Math.floor(this.next() * 256));
    b[6] = (b[6]! & 0x0f) | 0x40;
    b[8] = (b[8]! & 0x3f) | 0x80;
    const h = b.map((x) => x.toString(16).padStart(2, '0')).join('');
    return `${h.slice(0, 8)}-${h.slice(8, 12)}-${h.slice(12, 16)}-${h.slice(16, 20)}-${h.slice(20)}`;
  }
}

const firstA = ['Ma', 'To', 'Le', 'Ri', 'Sa', 'Bo', 'Ne', 'Di', 'Ka', 'Vi', 'Lo', 'Fe', 'Ze', 'Ju', 'Pa', 'Ro'];
const firstB = ['rel', 'wen', 'dra', 'nith', 'lo', 'mira', 'sen', 'vic', 'tessa', 'dor', 'lan', 'quin', 'bel', 'ro'];
const lastA = ['Quill', 'Brack', 'Ferr', 'Holt', 'Marl', 'Vess', 'Dun', 'Cald', 'Orv', 'Tamb', 'Lisk', 'Pell', 'Sorr', 'Wick'];
const lastB = ['ington', 'ow', 'amere', 'by', 'ston', 'ett', 'wold', 'ridge', 'ane', 'ock', 'ley', 'mont'];
const placeA = ['Cinder', 'Mesquite', 'Dry', 'Copper', 'Sage', 'Hollow', 'Red', 'Caliche', 'Windy', 'Juniper', 'Alkali', 'Ocotillo'];
const placeB = ['Flat', 'Wash', 'Bench', 'Mesa', 'Draw', 'Spring', 'Basin', 'Terrace', 'Arroyo', 'Hill'];

export function personName(rng: BenchRng): string {
  return `${rng.pick(firstA)}${rng.pick(firstB)} ${rng.pick(lastA)}${rng.pick(lastB)}`;
}

export function placeName(rng: BenchRng): string {
  return `${rng.pick(placeA)} ${rng.pick(placeB)}`;
}

const letters = 'ABCDEFGHJKMNPQRSTUVWXYZ';
/** A pseudonym unique within a cohort for member index i: "Grower K7" style. */
export function pseudonym(i: number, role: 'contributor' | 'observer' = 'contributor'): string {
  return `${role === 'observer' ? 'Observer' : 'Grower'} ${letters[i % letters.length]}${2 + Math.floor(i / letters.length)}`;
}
