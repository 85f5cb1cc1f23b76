/**
 * Where to bury ollas in a rectangular bed, and how often to refill them.
 *
 * Rule of thumb (common practice, no source): a buried unglazed pot wets the soil out to
 * about one pot radius beyond its wall, so the wetted circle around its centre has a radius
 * of radius + radius = one pot diameter.
 *
 * Layout rules used here:
 * - pots sit on a rectangular grid, one pot at the centre of each grid cell;
 * - every pot lies wholly inside the bed (centre at least half a diameter from each edge);
 * - pot centres are at least one widest diameter apart (walls may touch at the limit; pass
 *   a larger `minCentreSpacingM` to keep soil between pots);
 * - among the grids that respect those rules, the one with the fewest pots whose wetted
 *   circles cover the whole bed is chosen (a cell is covered when its half-diagonal is
 *   within the wetted radius); ties go to the grid with the most overlap;
 * - with `minCoverage` below 1 (e.g. 0.9: corners may stay dry), the fewest pots whose
 *   wetted circles cover at least that share of the bed, ties to the larger share: a grower
 *   who plants in the middle of the bed need not buy pots for its corners;
 * - when no allowed grid reaches the coverage asked for (narrow or awkward beds), the
 *   densest allowed grid is returned with fullCoverage = false and the covered fraction.
 */
import { AnalysisInputError, assertNonNegative, assertPositive } from '../analysis/input-error';

export interface Bed {
  lengthM: number;
  widthM: number;
}

export interface Pot {
  /** Widest outside diameter of the pot's body, m. */
  widestDiameterM: number;
}

export interface PlanOptions {
  /** Minimum distance between pot centres, default one widest diameter. */
  minCentreSpacingM?: number;
  /** Share of the bed the wetted zones must reach, 0.5–1; default 1 (the whole bed, corners too). */
  minCoverage?: number;
}

export interface OllaPlan {
  count: number;
  /** Pot centres in m, x along the length and y across the width, origin at a bed corner. */
  positions: Array<{ x: number; y: number }>;
  /** Radius of the wetted circle around each pot centre (= widest diameter), m. */
  wettedRadiusM: number;
  /** Grid spacing along the length (x) and the width (y), m. */
  spacingM: { x: number; y: number };
  columns: number;
  rows: number;
  fullCoverage: boolean;
  /** Fraction of the bed within the wetted radius of some pot (exact, see gridCoverage). */
  coveredFraction: number;
}

/** Wetted radius around a pot centre by the rule of thumb (common practice, no source). */
export function wettedRadiusM(widestDiameterM: number): number {
  assertPositive('widestDiameterM', widestDiameterM);
  return widestDiameterM;
}

/** Area of the wetted circle around one pot, m². */
export function wettedAreaM2(widestDiameterM: number): number {
  const r = wettedRadiusM(widestDiameterM);
  return Math.PI * r * r;
}

const EPS = 1e-9;

/**
 * Share of the bed within `radius` of some pot centre. Every grid cell is the same a × b
 * rectangle with its pot at the centre, and a point's nearest pot is its own cell's, so the bed's
 * share is one cell's: the area of the rectangle inside the circle, by integrating the circle's
 * half-height min(b/2, √(r² − x²)) over x from 0 to a/2 in closed form
 * (∫√(r² − x²) dx = (x√(r² − x²) + r² asin(x/r)) / 2, any calculus table).
 */
export function gridCoverage(a: number, b: number, radius: number): number {
  const A = a / 2;
  const B = b / 2;
  const r = radius;
  const F = (x: number) => (x * Math.sqrt(Math.max(0, r * r - x * x)) + r * r * Math.asin(Math.min(1, x / r))) / 2;
  // Up to x0 the circle is taller than the half-cell, so the whole half-height B counts.
  const x0 = Math.min(A, r > B ? Math.sqrt(r * r - B * B) : 0);
  const x1 = Math.min(A, r);
  const area = B * x0 + (x1 > x0 ? F(x1) - F(x0) : 0);
  return Math.min(1, area / (A * B));
}

/** Plan pot positions for a rectangular bed (see module note for the rules). */
export function planOllas(bed: Bed, pot: Pot, options: PlanOptions = {}): OllaPlan {
  assertPositive('lengthM', bed.lengthM);
  assertPositive('widthM', bed.widthM);
  const diameter = pot.widestDiameterM;
  const radius = wettedRadiusM(diameter);
  const minSpacing = options.minCentreSpacingM ?? diameter;
  assertPositive('minCentreSpacingM', minSpacing);
  if (minSpacing < diameter) {
    throw new AnalysisInputError(`minCentreSpacingM (${minSpacing}) cannot be less than the pot's diameter (${diameter}).`);
  }
  if (bed.lengthM + EPS < diameter || bed.widthM + EPS < diameter) {
    throw new AnalysisInputError(`A pot ${diameter} m wide does not fit in a ${bed.lengthM} × ${bed.widthM} m bed.`);
  }
  // A cell must be at least the minimum spacing wide (when there are several cells) and at
  // least one diameter wide (so the pot fits between the cell's walls at the bed edge).
  const maxCount = (side: number) => Math.max(1, Math.floor((side + EPS) / minSpacing));
  const maxColumns = maxCount(bed.lengthM);
  const maxRows = maxCount(bed.widthM);

  const minCoverage = options.minCoverage ?? 1;
  if (!(minCoverage >= 0.5 && minCoverage <= 1)) throw new AnalysisInputError(`minCoverage (${minCoverage}) must be between 0.5 and 1.`);
  const wholeBed = minCoverage >= 1;

  let best: { columns: number; rows: number; spread: number; covered: number } | undefined;
  for (let columns = 1; columns <= maxColumns; columns += 1) {
    const a = bed.lengthM / columns;
    for (let rows = 1; rows <= maxRows; rows += 1) {
      const b = bed.widthM / rows;
      const spread = a * a + b * b;
      const count = columns * rows;
      if (best && count > best.columns * best.rows) continue;
      const full = spread <= 4 * radius * radius + EPS;
      if (wholeBed && !full) continue;
      const covered = full ? 1 : gridCoverage(bed.lengthM / columns, bed.widthM / rows, radius);
      if (covered + EPS < minCoverage) continue;
      const better = wholeBed ? spread < (best?.spread ?? Infinity) : covered > (best?.covered ?? -1);
      if (!best || count < best.columns * best.rows || better) best = { columns, rows, spread, covered };
    }
  }
  const columns = best?.columns ?? maxColumns;
  const rows = best?.rows ?? maxRows;
  const covered = best?.covered ?? gridCoverage(bed.lengthM / columns, bed.widthM / rows, radius);
  const fullCoverage = covered >= 1;
  const x = bed.lengthM / columns;
  const y = bed.widthM / rows;
  const positions: Array<{ x: number; y: number }> = [];
  for (let row = 0; row < rows; row += 1) {
    for (let column = 0; column < columns; column += 1) {
      positions.push({ x: (column + 0.5) * x, y: (row + 0.5) * y });
    }
  }
  return {
    count: positions.length,
    positions,
    wettedRadiusM: radius,
    spacingM: { x, y },
    columns,
    rows,
    fullCoverage,
    coveredFraction: covered,
  };
}

export interface RefillInput {
  /** Water the pot holds when full, L. */
  capacityL: number;
  /** Measured seepage of this pot, L/day (e.g. from seepageRateFromLevels). Preferred when given. */
  seepageLPerDay?: number;
  /** Crop water need, mm/day (e.g. ETc = Kc·ET0). Used with wettedAreaM2 when no seepage is measured. */
  cropNeedMmPerDay?: number;
  /** Soil area the pot serves, m² (1 mm over 1 m² = 1 L). */
  wettedAreaM2?: number;
}

export interface RefillInterval {
  /** Days from full to empty at the daily draw (Infinity when the draw is 0). */
  days: number;
  dailyDrawL: number;
  basis: 'measured-seepage' | 'crop-need';
}

/**
 * Days between refills: capacity divided by the daily draw. The draw is the measured
 * seepage when given (the pot's actual release), otherwise the crop need over the wetted
 * area (mm/day × m² = L/day). Throws when neither can be worked out. Refilling every day or
 * two in hot weather is common practice (no source); this gives the figure for a given pot.
 */
export function refillIntervalDays(input: RefillInput): RefillInterval {
  assertPositive('capacityL', input.capacityL);
  let dailyDrawL: number;
  let basis: RefillInterval['basis'];
  if (input.seepageLPerDay !== undefined) {
    assertNonNegative('seepageLPerDay', input.seepageLPerDay);
    dailyDrawL = input.seepageLPerDay;
    basis = 'measured-seepage';
  } else if (input.cropNeedMmPerDay !== undefined && input.wettedAreaM2 !== undefined) {
    assertNonNegative('cropNeedMmPerDay', input.cropNeedMmPerDay);
    assertPositive('wettedAreaM2', input.wettedAreaM2);
    dailyDrawL = input.cropNeedMmPerDay * input.wettedAreaM2;
    basis = 'crop-need';
  } else {
    throw new AnalysisInputError('Give either seepageLPerDay, or cropNeedMmPerDay together with wettedAreaM2.');
  }
  return {
    days: dailyDrawL === 0 ? Number.POSITIVE_INFINITY : input.capacityL / dailyDrawL,
    dailyDrawL,
    basis,
  };
}
