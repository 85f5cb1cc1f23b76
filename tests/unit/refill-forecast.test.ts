// The refill model is arithmetic on the pot's own numbers (capacity, logged refill, measured
// seep rate), so most expected values below are worked by hand from those definitions. Outside
// values name their source: Kc from FAO-56 Table 12 (V(t) in shared/REFERENCES.md). The 25 %
// default threshold, the 5 mm/day fallback ET0 and "frost at ≤ 0 °C" are common practice, no source.
import { describe, expect, it, test } from 'vitest';
import { AnalysisInputError } from '@shared/analysis/input-error';
import { et0ForDay } from '@shared/agronomy/et0';
import {
  addDays,
  cropNeedMmPerDay,
  DEFAULT_ET0_MM_PER_DAY,
  DEFAULT_REFILL_THRESHOLD_PCT,
  forecastRefill,
  frostNights,
  gardenEt0,
  onStepper,
  suggestTopUp,
  urgencyOrder,
} from '@shared/agronomy/refill-forecast';

const filled = '2026-06-01T07:00:00.000Z';
const after = (days: number) => new Date(Date.parse(filled) + days * 86_400_000);

describe('forecastRefill', () => {
  it('draws a 10 L pot down at its seep rate: 4 L lost over 24 h is 4 L/day', () => {
    const input = { capacityL: 10, lastRefill: { at: filled, volumeL: 10, firstFill: true }, seepLPerDay: 4 * (24 / 24) };
    const day1 = forecastRefill({ ...input, now: after(1) });
    expect(day1).toMatchObject({ basis: 'seep-test', dailyDrawL: 4, startL: 10, belowThreshold: false, dry: false });
    expect(day1.levelL).toBeCloseTo(6, 12);
    expect(day1.levelPct).toBeCloseTo(60, 12);
    // 25 % of 10 L is 2.5 L: reached after (10 − 2.5) / 4 = 1.875 days; dry after 10 / 4 = 2.5 days.
    expect(day1.thresholdAt).toBe(after(1.875).toISOString());
    expect(day1.dryAt).toBe(after(2.5).toISOString());

    const day2 = forecastRefill({ ...input, now: after(2) });
    expect(day2.levelL).toBeCloseTo(2, 12);
    expect(day2.levelPct).toBeCloseTo(20, 12);
    expect(day2.belowThreshold).toBe(true);

    const day3 = forecastRefill({ ...input, now: after(3) });
    expect(day3).toMatchObject({ levelL: 0, levelPct: 0, dry: true, belowThreshold: true });
  });

  it('uses the default threshold of 25 % when none is given', () => {
    expect(DEFAULT_REFILL_THRESHOLD_PCT).toBe(25);
    // 2.6 L of 10 L is 26 %: not yet below; 2.4 L is.
    const at = (levelAfterL: number) => forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: 10 - levelAfterL, now: after(1) });
    expect(at(2.6).belowThreshold).toBe(false);
    expect(at(2.4).belowThreshold).toBe(true);
  });

  it('moves the reminder day with the threshold', () => {
    const base = { capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: 4, now: after(1) };
    // At 60 % left: below a 65 % threshold, not below 50 %.
    expect(forecastRefill({ ...base, thresholdPct: 65 }).belowThreshold).toBe(true);
    expect(forecastRefill({ ...base, thresholdPct: 50 }).belowThreshold).toBe(false);
    // (10 − 6.5) / 4 = 0.875 days.
    expect(forecastRefill({ ...base, thresholdPct: 65 }).thresholdAt).toBe(after(0.875).toISOString());
  });

  it('counts a later refill as filling the pot to capacity, whatever volume it took', () => {
    const f = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 3 }, seepLPerDay: 2, now: after(1) });
    expect(f.startL).toBe(10);
    expect(f.levelL).toBeCloseTo(8, 12);
  });

  it('takes the first fill of a new pot as the volume poured, at most its capacity', () => {
    const part = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 4, firstFill: true }, seepLPerDay: 1, now: after(1) });
    expect(part.startL).toBe(4);
    expect(part.levelL).toBeCloseTo(3, 12);
    const spill = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 12, firstFill: true }, seepLPerDay: 1, now: after(0) });
    expect(spill.startL).toBe(10);
    // A first fill already under the threshold is below it from the moment it was poured.
    const low = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 2, firstFill: true }, seepLPerDay: 1, now: after(0) });
    expect(low.belowThreshold).toBe(true);
    expect(low.thresholdAt).toBe(filled);
  });

  it('uses the crop need over the wetted area before any seep test (mm/day × m² = L/day)', () => {
    const f = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: null, cropNeed: { etcMmPerDay: 3, wettedAreaM2: 0.5 }, now: after(2) });
    expect(f.basis).toBe('crop-need');
    expect(f.dailyDrawL).toBeCloseTo(1.5, 12);
    expect(f.levelL).toBeCloseTo(7, 12);
  });

  it('prefers a measured seep rate over the crop need', () => {
    const f = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: 0.8, cropNeed: { etcMmPerDay: 6, wettedAreaM2: 1 }, now: after(1) });
    expect(f).toMatchObject({ basis: 'seep-test', dailyDrawL: 0.8 });
  });

  it('knows no level before the first refill, and no draw without a seep test or a crop need', () => {
    const noRefill = forecastRefill({ capacityL: 10, lastRefill: null, seepLPerDay: 2, now: after(1) });
    expect(noRefill).toMatchObject({ basis: 'seep-test', levelL: null, levelPct: null, dryAt: null, belowThreshold: false });
    const noDraw = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: null, cropNeed: null, now: after(1) });
    expect(noDraw).toMatchObject({ basis: null, dailyDrawL: null, levelL: null, belowThreshold: false });
  });

  it('never runs dry at a draw of zero', () => {
    const f = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: 0, now: after(30) });
    expect(f).toMatchObject({ levelL: 10, dryAt: null, thresholdAt: null, belowThreshold: false });
  });

  it('treats a refill logged after "now" as just filled', () => {
    const f = forecastRefill({ capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: 4, now: after(-0.5) });
    expect(f.levelL).toBe(10);
  });

  test.each([
    [{ capacityL: 0 }, /capacityL/],
    [{ thresholdPct: 0 }, /thresholdPct/],
    [{ thresholdPct: 100 }, /thresholdPct/],
    [{ thresholdPct: Number.NaN }, /thresholdPct/],
    [{ now: 'yesterday' }, /now must be a date/],
    [{ lastRefill: { at: 'soon', volumeL: 5 } }, /lastRefill.at/],
    [{ lastRefill: { at: filled, volumeL: -1 } }, /volumeL/],
    [{ seepLPerDay: -2 }, /seepageLPerDay/],
  ])('refuses %j with a clear message', (override, message) => {
    const input = { capacityL: 10, lastRefill: { at: filled, volumeL: 10 }, seepLPerDay: 4, now: after(1), ...override };
    expect(() => forecastRefill(input as Parameters<typeof forecastRefill>[0])).toThrow(AnalysisInputError);
    expect(() => forecastRefill(input as Parameters<typeof forecastRefill>[0])).toThrow(message);
  });
});

describe('crop need', () => {
  it('is Kc × ET0 with FAO-56 Table 12 tomato Kc (0.6 initial, 1.15 mid-season)', () => {
    // Tomato stages (Table 11, from memory in crop-coefficients.ts): initial 30 d, development 40 d, mid 40 d.
    expect(cropNeedMmPerDay({ crop: 'tomato', plantingDate: '2026-05-01', onDate: '2026-05-01', et0MmPerDay: 5 })!.etcMmPerDay).toBeCloseTo(0.6 * 5, 12);
    expect(cropNeedMmPerDay({ crop: 'tomato', plantingDate: '2026-05-01', onDate: '2026-07-20', et0MmPerDay: 5 })!.etcMmPerDay).toBeCloseTo(1.15 * 5, 12);
    // Before planting the initial Kc applies.
    expect(cropNeedMmPerDay({ crop: 'tomato', plantingDate: '2026-05-01', onDate: '2026-04-20', et0MmPerDay: 5 })!.kc).toBe(0.6);
  });

  it("applies the trial's Kc overrides and has no value for crops without coefficients", () => {
    expect(cropNeedMmPerDay({ crop: 'tomato', kcOverrides: { ini: 0.4 }, plantingDate: '2026-05-01', onDate: '2026-05-02', et0MmPerDay: 5 })!.etcMmPerDay).toBeCloseTo(2, 12);
    expect(cropNeedMmPerDay({ crop: 'other', plantingDate: '2026-05-01', onDate: '2026-05-02', et0MmPerDay: 5 })).toBeNull();
  });
});

describe('gardenEt0', () => {
  const site = { latitudeDeg: 35.1, elevationM: 1500 };
  it('falls back to 5 mm/day without weather in the last week (common practice, no source)', () => {
    expect(DEFAULT_ET0_MM_PER_DAY).toBe(5);
    expect(gardenEt0([], site, '2026-06-10')).toEqual({ et0MmPerDay: 5, source: 'default', days: 0 });
    // A day 7 days back is outside the window (today − 6 … today).
    expect(gardenEt0([{ date: '2026-06-03', tMinC: 15, tMaxC: 32 }], site, '2026-06-10').source).toBe('default');
  });

  it("averages the FAO-56 ET0 of the week's logged days", () => {
    const days = [
      { date: '2026-06-04', tMinC: 15, tMaxC: 32 },
      { date: '2026-06-10', tMinC: 18, tMaxC: 36 },
      { date: '2026-06-11', tMinC: 10, tMaxC: 20 }, // after today: left out
    ];
    const expected = (et0ForDay(days[0]!, site).et0Mm + et0ForDay(days[1]!, site).et0Mm) / 2;
    const r = gardenEt0(days, site, '2026-06-10');
    expect(r.source).toBe('weather');
    expect(r.days).toBe(2);
    expect(r.et0MmPerDay).toBeCloseTo(expected, 12);
  });
});

describe('frostNights (≤ 0 °C: common practice, no source)', () => {
  it('warns at 0 °C and not at 0.5 °C', () => {
    expect(frostNights([{ day: '2026-10-20', tMinC: 0, forecast: true }], '2026-10-20')).toEqual([{ day: '2026-10-20', tMinC: 0, forecast: true }]);
    expect(frostNights([{ day: '2026-10-20', tMinC: 0.5, forecast: true }], '2026-10-20')).toEqual([]);
  });

  it('looks at today and the next 2 days only, and takes the lower of logged and forecast', () => {
    const nights = frostNights(
      [
        { day: '2026-10-19', tMinC: -3, forecast: false }, // yesterday
        { day: '2026-10-21', tMinC: 1, forecast: false },
        { day: '2026-10-21', tMinC: -1, forecast: true },
        { day: '2026-10-22', tMinC: -2, forecast: true },
        { day: '2026-10-23', tMinC: -5, forecast: true }, // 3 days ahead
      ],
      '2026-10-20',
    );
    expect(nights).toEqual([
      { day: '2026-10-21', tMinC: -1, forecast: true },
      { day: '2026-10-22', tMinC: -2, forecast: true },
    ]);
  });
});

describe('dates and order', () => {
  it('adds calendar days across a month end and refuses a date that is not YYYY-MM-DD', () => {
    expect(addDays('2026-02-27', 2)).toBe('2026-03-01');
    expect(() => addDays('27/02/2026', 1)).toThrow(AnalysisInputError);
  });

  it('orders pots soonest-dry first, never-dry next, unknown last', () => {
    const pots = [
      { id: 'unknown', dryAt: null, levelPct: null },
      { id: 'never', dryAt: null, levelPct: 100 },
      { id: 'later', dryAt: '2026-06-05T00:00:00Z', levelPct: 70 },
      { id: 'sooner', dryAt: '2026-06-03T00:00:00Z', levelPct: 30 },
    ];
    expect([...pots].sort(urgencyOrder).map((p) => p.id)).toEqual(['sooner', 'later', 'never', 'unknown']);
  });
});

// The top-up suggestion is the same straight-line model (the pot full after its last refill, losing
// its seep-test rate every day): linear seepage is a simplification, common practice, no source.
// Expected values are worked by hand from capacity − rate × days.
describe('suggestTopUp', () => {
  const pot = { capacityL: 8, seepLPerDay: 3 * (24 / 12), lastRefill: { at: filled, volumeL: 7 } };

  it('suggests what it takes to fill the pot: 6 L/day for 10 h is 2.5 L gone, so 2.5 L to fill', () => {
    const s = suggestTopUp({ ...pot, now: after(10 / 24) });
    expect(s.basis).toBe('seep-test');
    expect(s.levelL).toBeCloseTo(5.5, 12);
    expect(s.topUpL).toBeCloseTo(2.5, 12);
    // Not the 7 L the last refill took: that pot was nearer empty then.
    expect(s.topUpL).not.toBeCloseTo(pot.lastRefill.volumeL, 6);
  });

  it('suggests the whole capacity for a pot estimated exactly empty, and never more (clamped)', () => {
    // 8 L at 6 L/day is empty after 8 / 6 days exactly.
    const empty = suggestTopUp({ ...pot, now: after(8 / 6) });
    expect(empty.levelL).toBeCloseTo(0, 12);
    expect(empty.topUpL).toBeCloseTo(8, 12);
    // A week later the straight line is far below zero; the pot still only takes its capacity.
    expect(suggestTopUp({ ...pot, now: after(7) })).toEqual({ basis: 'seep-test', levelL: 0, topUpL: 8 });
  });

  it('suggests nothing for a pot just filled, or filled "after" now (a phone clock behind the entry)', () => {
    expect(suggestTopUp({ ...pot, now: filled })).toEqual({ basis: 'seep-test', levelL: 8, topUpL: 0 });
    expect(suggestTopUp({ ...pot, now: after(-0.5) })).toEqual({ basis: 'seep-test', levelL: 8, topUpL: 0 });
    // A pot that loses nothing (0 L in its seep test) stays full.
    expect(suggestTopUp({ ...pot, seepLPerDay: 0, now: after(30) })).toEqual({ basis: 'seep-test', levelL: 8, topUpL: 0 });
  });

  it('falls back to the last refill without a seep test, and to a full pot without a refill', () => {
    expect(suggestTopUp({ ...pot, seepLPerDay: null, now: after(3) })).toEqual({ basis: 'last-refill', levelL: null, topUpL: 7 });
    // A seep test alone says nothing about the level without a refill to start from.
    expect(suggestTopUp({ ...pot, lastRefill: null, now: after(3) })).toEqual({ basis: 'capacity', levelL: null, topUpL: 8 });
    expect(suggestTopUp({ ...pot, seepLPerDay: null, lastRefill: null, now: after(3) })).toEqual({ basis: 'capacity', levelL: null, topUpL: 8 });
    // `now` may be a number of milliseconds, as Date.now() gives it.
    expect(suggestTopUp({ ...pot, now: after(10 / 24).getTime() }).topUpL).toBeCloseTo(2.5, 12);
  });

  it('refuses a pot without capacity and a negative seep rate', () => {
    expect(() => suggestTopUp({ ...pot, capacityL: 0, now: after(1) })).toThrow(AnalysisInputError);
    expect(() => suggestTopUp({ ...pot, seepLPerDay: -1, now: after(1) })).toThrow(AnalysisInputError);
  });
});

// The Round's stepper (0.5 L metric, 0.25 gal US): arithmetic only, no source needed.
describe('onStepper', () => {
  it('rounds to the nearest step', () => {
    expect(onStepper(2.4, 0.5, 8)).toBe(2.5);
    expect(onStepper(2.2, 0.5, 8)).toBe(2);
    expect(onStepper(0.2, 0.5, 8)).toBe(0);
  });
  it('never offers more than the pot holds: a 2.64 gal pot that is empty is offered 2.5 gal, not 2.75', () => {
    expect(onStepper(2.64, 0.25, 2.64)).toBe(2.5);
    expect(onStepper(3, 0.25, 2.9)).toBe(2.75);
    expect(onStepper(8, 0.5, 8)).toBe(8);
  });
  it('refuses a step that is not positive', () => {
    expect(() => onStepper(1, 0, 8)).toThrow();
  });
});
