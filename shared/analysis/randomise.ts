import seedrandom from 'seedrandom';
import { AnalysisInputError } from './input-error';

export interface PlotToAssign {
  id: string;
  label: string;
  blockKey: string;
}

export interface Assignment {
  plotId: string;
  treatment: string;
}

/**
 * Assigns treatments at random within each pair or block: every block must hold exactly one plot
 * per treatment, and each block gets an independent random permutation (Fisher-Yates with a
 * seeded generator). Blocks and plots are taken in label order, so the same seed and the same
 * plots always give the same assignment.
 */
export function randomiseWithinBlocks(plots: PlotToAssign[], treatments: string[], seed: string): Assignment[] {
  if (treatments.length < 2) throw new AnalysisInputError('A trial needs at least two treatments to randomise.');
  const blocks = new Map<string, PlotToAssign[]>();
  for (const p of plots) {
    const list = blocks.get(p.blockKey) ?? [];
    list.push(p);
    blocks.set(p.blockKey, list);
  }
  if (blocks.size === 0) throw new AnalysisInputError('Add plots before randomising.');
  const rng = seedrandom(seed);
  const out: Assignment[] = [];
  for (const key of [...blocks.keys()].sort((a, b) => a.localeCompare(b, 'en'))) {
    const members = blocks.get(key)!.sort((a, b) => a.label.localeCompare(b.label, 'en', { numeric: true }));
    if (members.length !== treatments.length) {
      throw new AnalysisInputError(
        `Pair or block "${key}" has ${members.length} plot${members.length === 1 ? '' : 's'}; it needs exactly ${treatments.length} (one for each treatment).`,
      );
    }
    const order = [...treatments];
    for (let i = order.length - 1; i > 0; i--) {
      const j = Math.floor(rng() * (i + 1));
      [order[i], order[j]] = [order[j]!, order[i]!];
    }
    members.forEach((plot, i) => out.push({ plotId: plot.id, treatment: order[i]! }));
  }
  return out;
}
