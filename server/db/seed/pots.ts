/**
 * The demo growers' pots: each one's size, shape and true seep rate, where it sits, and the
 * seep tests the grower ran on it.
 */
import { randomUUID } from 'node:crypto';
import type { PotCondition, SeepSetting } from '@shared/schemas/pots';
import type { GrowerPlan, PotRecipe, SparePot } from './cast';
import { addDays, localTime } from './dates';
import { airSeepLPerDay, potDimensions } from './model';
import { round, roundTo, type Rng } from './random';
import type { SeasonRows } from './tables';

export interface PotState {
  id: string;
  label: string;
  recipe: PotRecipe;
  capacityL: number;
  /** The pot's true seep rate in air, L/day (tests read it with some noise). */
  airLPerDay: number;
  plotId: string | null;
  installedOn: string | null;
  condition: PotCondition;
  notes: string;
  /** Water in the pot now, L (simulation state). */
  contentL: number;
  /** Litres lost each day in the bed (for the in-bed seep test). */
  lossByDay: Map<string, number>;
  /** Tests given by the scenario instead of a generated spring test. */
  fixedTests?: SparePot['tests'];
  /** On the shelf at the start of the season (tested in spring even if installed later). */
  spare: boolean;
}

/** One grower's pot shelf: numbers new pots and writes pots and seep tests at the end. */
export class PotShelf {
  readonly pots: PotState[] = [];
  private next = 1;

  constructor(
    private readonly plan: GrowerPlan,
    private readonly ownerId: string,
    private readonly rng: Rng,
  ) {
    for (const spare of plan.spares ?? [])
      this.add(spare.label, spare.recipe, spare.capacityL, { condition: spare.condition, notes: spare.notes, fixedTests: spare.tests, spare: true });
  }

  /** A new pot of the grower's usual kind, installed in a plot. */
  install(plotId: string, installedOn: string): PotState {
    const [lo, hi] = this.plan.potRecipe.capacityL;
    const capacity = roundTo(this.rng.uniform(lo, hi), 0.5);
    const pot = this.add(`${this.plan.potPrefix}${this.next++}`, this.plan.potRecipe, capacity, { notes: this.plan.potRecipe.notes });
    pot.plotId = plotId;
    pot.installedOn = installedOn;
    return pot;
  }

  byLabel(label: string): PotState {
    const pot = this.pots.find((p) => p.label === label);
    if (!pot) throw new Error(`No pot labelled ${label} on ${this.plan.email}'s shelf.`);
    return pot;
  }

  private add(
    label: string,
    recipe: PotRecipe,
    capacityL: number,
    extra: { condition?: PotCondition; notes: string; fixedTests?: SparePot['tests']; spare?: boolean },
  ): PotState {
    const pot: PotState = {
      id: randomUUID(),
      label,
      recipe,
      capacityL,
      airLPerDay: airSeepLPerDay(capacityL, recipe.firingCone, recipe.make, this.rng, recipe.matchedSet),
      plotId: null,
      installedOn: null,
      condition: extra.condition ?? 'sound',
      notes: extra.notes,
      contentL: 0,
      lossByDay: new Map(),
      fixedTests: extra.fixedTests,
      spare: extra.spare ?? false,
    };
    this.pots.push(pot);
    return pot;
  }

  /**
   * Writes the pots and their tests: a spring test before first use (in air or saturated
   * sand, as the grower does it) and, where the trial asks for it, a 48-hour test in the bed.
   */
  write(rows: SeasonRows, firstPlanting: string, createdAt: string, inBedTests: { pot: PotState; day: string }[]): void {
    for (const pot of this.pots) {
      const dims = potDimensions(pot.recipe.shape, pot.capacityL, this.rng);
      rows.pots.push({
        id: pot.id,
        owner_id: this.ownerId,
        label: pot.label,
        capacity_l: pot.capacityL,
        height_cm: dims.heightCm,
        widest_diameter_cm: dims.widestDiameterCm,
        neck_diameter_cm: dims.neckDiameterCm,
        shape: pot.recipe.shape,
        clay_body: pot.recipe.clayBody,
        make: pot.recipe.make,
        firing_cone: pot.recipe.firingCone,
        installed_on: pot.installedOn,
        plot_id: pot.plotId,
        condition: pot.condition,
        notes: pot.notes,
        created_at: createdAt,
        updated_at: createdAt,
      });
      if (pot.fixedTests) {
        for (const t of pot.fixedTests) this.pushTest(rows, pot, t.testedOn, t.setting, t.hours, (t.litresPerDay * t.hours) / 24, t.notes);
      } else {
        const { setting, hours } = this.plan.habits.seepTest;
        const before = !pot.spare && pot.installedOn && pot.installedOn > firstPlanting ? pot.installedOn : firstPlanting;
        const rate = pot.airLPerDay * (setting === 'saturated_sand' ? 0.8 : 1);
        const notes =
          setting === 'air'
            ? 'Filled to the neck on the porch, level marked, topped up from a measuring jug.'
            : 'Buried in a tub of wet sand, topped up from a measuring jug.';
        this.pushTest(rows, pot, addDays(before, -this.rng.int(10, 24)), setting, hours, (rate * hours * this.rng.factor(0.04)) / 24, notes);
      }
    }
    for (const { pot, day } of inBedTests) {
      const lost = (pot.lossByDay.get(addDays(day, 1)) ?? 0) + (pot.lossByDay.get(addDays(day, 2)) ?? 0);
      if (lost > 0)
        this.pushTest(rows, pot, day, 'in_bed', 48, lost * this.rng.factor(0.03), 'Level drop over 48 hours on a dipstick, in the bed with the plants.');
    }
  }

  private pushTest(rows: SeasonRows, pot: PotState, testedOn: string, setting: SeepSetting, hours: number, litres: number, notes: string) {
    rows.seep_tests.push({
      id: randomUUID(),
      pot_id: pot.id,
      tested_on: testedOn,
      setting,
      litres_lost: round(litres, 2),
      hours,
      notes,
      created_at: localTime(addDays(testedOn, hours / 24), 19, this.rng.int(0, 50)),
    });
  }
}
