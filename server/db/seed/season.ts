/**
 * Generates the Saltbush Bend 2026 season from the plans in cast.ts: gardens, weather, trials
 * with randomised pairs, pots and seep tests, every walk's refills and waterings, moisture
 * readings, picks, notes, shares and audit entries. Deterministic (seeded); nothing here is a
 * result: the analysis computes savings, tests and flags from these logs as it would from a
 * real grower's.
 */
import { randomUUID } from 'node:crypto';
import type { EntityManager } from 'typeorm';
import { CROP_COEFFICIENTS, kcForDay, type CropId } from '@shared/agronomy/crop-coefficients';
import { randomiseWithinBlocks } from '@shared/analysis/randomise';
import type { WaterKind } from '@shared/schemas/logs';
import { LITRES_PER_US_GALLON } from '@shared/units';
import { DEMO_PROTOCOL, GROWERS, type GrowerPlan, type SourceRule, type TrialPlan } from './cast';
import { CLIMATE, forecastDays, gardenWeather, townSeries, type GardenSite, type TownSeries, type WeatherDay } from './climate';
import { addDays, addMinutes, daysBetween, DEMO_TIME_ZONE, eachDay, localTime, within } from './dates';
import {
  CROP_PROFILES,
  FULL_PICKING_DAYS,
  groundCover,
  moistureValue,
  OLLA_WETNESS,
  POT_UPTAKE,
  DRY_WETNESS,
  ROOT_ZONE_STORE_MM,
  SETTING_SEEP_FACTOR,
  SOILS,
  stressThreshold,
  SURFACE_EFFICIENCY,
  SURFACE_TRIGGER_MM,
  WATERING_IN_MM,
} from './model';
import { PotShelf, type PotState } from './pots';
import { clamp, round, roundTo, Rng } from './random';
import { emptySeasonRows, insertSeason, type SeasonRows, type SeasonTable } from './tables';

/** Generates the season in memory (no database). `userIds` maps e-mail to user id. */
export function generateSeason(userIds: Record<string, string>, networkCohortId: string): SeasonRows {
  const rows = emptySeasonRows();
  const town = townSeries();
  for (const plan of GROWERS) {
    const ownerId = userIds[plan.email];
    if (!ownerId) throw new Error(`The demo season needs an account for ${plan.email}.`);
    new GardenSeason(plan, ownerId, networkCohortId, town, rows).grow();
  }
  return rows;
}

/** Generates the season and inserts it inside the caller's transaction. */
export async function seedSeason(tx: EntityManager, userIds: Record<string, string>, networkCohortId: string): Promise<Record<SeasonTable, number>> {
  return insertSeason(tx, generateSeason(userIds, networkCohortId));
}

interface PlotSim {
  id: string;
  label: string;
  pair: number;
  treatment: 'olla' | 'surface';
  areaM2: number;
  pots: PotState[];
  /** Crop water use since the last watering, mm (surface beds; olla beds while establishing). */
  deficitMm: number;
  /** 0 dry … 1 wet, at the moisture probe's depth. */
  wetness: number;
  /** Days the plants went short of water (dry soil, or every pot empty). */
  stressDays: Set<string>;
  /** This bed's share of the grower's habit (the bed by the tap gets a little more). */
  habit: number;
}

interface Walk {
  at: string;
  /** Minutes into the walk, so the logs of one walk follow each other. */
  step: number;
}

/** One grower's garden through the season. */
class GardenSeason {
  private readonly rng: Rng;
  private readonly gardenId = randomUUID();
  private readonly shelf: PotShelf;
  private readonly walks: Map<string, string>;
  private readonly weather: Map<string, WeatherDay>;
  private readonly seasonFrom: string;
  private readonly seasonTo: string;
  private readonly trialIds: string[] = [];
  private readonly plotsByTrial: PlotSim[][] = [];
  private readonly inBedTests: { pot: PotState; day: string }[] = [];

  constructor(
    private readonly plan: GrowerPlan,
    private readonly ownerId: string,
    private readonly cohortId: string,
    private readonly town: TownSeries,
    private readonly rows: SeasonRows,
  ) {
    this.rng = new Rng(`garden:${plan.email}`);
    this.shelf = new PotShelf(plan, ownerId, new Rng(`pots:${plan.email}`));
    this.seasonFrom = plan.trials.map((t) => t.plantingDate).sort()[0]!;
    this.seasonTo = plan.trials
      .map((t) => t.lastLogDate)
      .sort()
      .at(-1)!;
    this.walks = walkTimes(plan, this.seasonFrom, this.seasonTo);
    this.weather = new Map();
  }

  private get site(): GardenSite {
    const g = this.plan.garden;
    return { key: this.plan.email, latitudeDeg: g.latitudeDeg, elevationM: g.elevationM, microclimateC: g.microclimateC, station: g.station };
  }

  grow(): void {
    const g = this.plan.garden;
    const createdAt = localTime(addDays(this.seasonFrom, -35), 19, 10);
    this.rows.gardens.push({
      id: this.gardenId,
      owner_id: this.ownerId,
      name: g.name,
      latitude_deg: g.latitudeDeg,
      longitude_deg: g.longitudeDeg,
      elevation_m: g.elevationM,
      soil_texture: g.soil,
      coastal: false,
      notes: g.notes,
      time_zone: DEMO_TIME_ZONE,
      created_at: createdAt,
      updated_at: createdAt,
    });
    this.writeWeather();
    this.plan.trials.forEach((t, i) => this.growTrial(t, i));
    this.shelf.write(this.rows, this.seasonFrom, localTime(addDays(this.seasonFrom, -30), 20), this.inBedTests);
    this.writeObservations();
  }

  private writeWeather(): void {
    for (const w of gardenWeather(this.town, this.site, this.seasonFrom, this.seasonTo)) {
      this.weather.set(w.day, w);
      this.pushWeather(w.day, false, w, localTime(w.day, 20, 30));
    }
    const f = this.plan.forecast;
    if (f) {
      for (const day of forecastDays(this.site, this.seasonTo, f.days, f.frost)) {
        this.pushWeather(day.day, true, { ...day, rhMinPct: null, rhMaxPct: null, windSpeedMs: null, sunshineHours: null }, localTime(this.seasonTo, 20, 45));
      }
    }
  }

  private pushWeather(day: string, forecast: boolean, w: Omit<WeatherDay, 'day' | 'et0Mm'>, createdAt: string): void {
    this.rows.weather_days.push({
      id: randomUUID(),
      garden_id: this.gardenId,
      day,
      forecast,
      t_min_c: w.tMinC,
      t_max_c: w.tMaxC,
      rain_mm: w.rainMm,
      rh_min_pct: w.rhMinPct,
      rh_max_pct: w.rhMaxPct,
      wind_speed_ms: w.windSpeedMs,
      wind_height_m: 2,
      sunshine_hours: w.sunshineHours,
      entered_by: this.ownerId,
      created_at: createdAt,
    });
  }

  private growTrial(tp: TrialPlan, index: number): void {
    const trialId = randomUUID();
    this.trialIds[index] = trialId;
    const seed = `sb26-${tp.key}`;
    const plots = this.layOutPlots(tp, trialId, seed);
    this.plotsByTrial[index] = plots;
    new TrialSeason(this, tp, trialId, plots).simulate();
    const thresholds = tp.moisture ? { [tp.moisture.method]: stressThreshold(tp.moisture.method, this.plan.garden.soil) } : {};
    this.rows.trials.push({
      id: trialId,
      garden_id: this.gardenId,
      owner_id: this.ownerId,
      title: tp.title,
      crop: tp.crop,
      crop_name: '',
      variety: tp.variety,
      planting_date: tp.plantingDate,
      end_date: tp.endDate,
      design: 'paired',
      treatments: JSON.stringify(['olla', 'surface']),
      question: tp.question,
      protocol_notes: DEMO_PROTOCOL,
      kc_overrides: JSON.stringify(tp.kcOverrides ?? {}),
      stress_thresholds: JSON.stringify(thresholds),
      status: tp.status,
      randomisation_seed: seed,
      created_at: localTime(addDays(tp.plantingDate, -21), 20),
      updated_at: localTime(tp.endDate ?? tp.lastLogDate, 18),
    });
    this.writeSharingAndAudit(tp, trialId);
  }

  /** Two plots per pair, labelled 1A/1B…; treatments drawn within each pair by the shared randomiser. */
  private layOutPlots(tp: TrialPlan, trialId: string, seed: string): PlotSim[] {
    const profile = CROP_PROFILES[tp.crop];
    const plots: PlotSim[] = tp.pairAreasM2.flatMap((areaM2, i) =>
      (['A', 'B'] as const).map((side) => ({
        id: randomUUID(),
        label: `${i + 1}${side}`,
        pair: i + 1,
        treatment: 'surface' as const,
        areaM2,
        pots: [],
        deficitMm: 0,
        wetness: 0.6,
        stressDays: new Set<string>(),
        habit: this.rng.factor(0.12),
      })),
    );
    const assignment = randomiseWithinBlocks(
      plots.map((p) => ({ id: p.id, label: p.label, blockKey: `Pair ${p.pair}` })),
      ['olla', 'surface'],
      seed,
    );
    for (const a of assignment) plots.find((p) => p.id === a.plotId)!.treatment = a.treatment as 'olla' | 'surface';
    for (const p of plots) {
      if (p.treatment === 'olla') for (let i = 0; i < tp.potsPerOllaPlot; i++) p.pots.push(this.shelf.install(p.id, tp.plantingDate));
      if (tp.inBedSeepTestOn) for (const pot of p.pots) this.inBedTests.push({ pot, day: tp.inBedSeepTestOn });
      this.rows.plots.push({
        id: p.id,
        trial_id: trialId,
        label: p.label,
        treatment: p.treatment,
        block_key: `Pair ${p.pair}`,
        area_m2: p.areaM2,
        setting: tp.setting,
        mulch: tp.mulch,
        lid: tp.lid,
        plant_count: Math.max(1, Math.round(p.areaM2 * profile.plantsPerM2)),
        created_at: localTime(addDays(tp.plantingDate, -20), 20, 30),
      });
    }
    return plots;
  }

  private writeSharingAndAudit(tp: TrialPlan, trialId: string): void {
    const audit = (at: string, action: string, entityType: string, entityId: string, changes: object) =>
      this.rows.audit_entries.push({
        id: randomUUID(),
        trial_id: trialId,
        actor_id: this.ownerId,
        at,
        action,
        entity_type: entityType,
        entity_id: entityId,
        changes: JSON.stringify(changes),
      });
    audit(localTime(tp.plantingDate, 7, 30), 'status', 'trial', trialId, { status: ['draft', 'active'] });
    if (tp.sharedOn) this.rows.trial_shares.push({ id: randomUUID(), trial_id: trialId, cohort_id: this.cohortId, shared_at: localTime(tp.sharedOn, 20, 15) });
    if (tp.status === 'closed' && tp.endDate) audit(localTime(tp.endDate, 17, 45), 'status', 'trial', trialId, { status: ['active', 'closed'] });
  }

  /** The walk on a day, if any: a forced walk (planting, last day, a crisis) or the usual round. */
  walkOn(day: string, forced: Map<string, string>): Walk | null {
    const at = forced.get(day) ?? this.walks.get(day);
    return at ? { at, step: 0 } : null;
  }

  weatherOn(day: string): WeatherDay {
    const w = this.weather.get(day);
    if (!w) throw new Error(`No weather for ${day} at ${this.plan.garden.name}.`);
    return w;
  }

  get grower(): GrowerPlan {
    return this.plan;
  }

  get owner(): string {
    return this.ownerId;
  }

  get shelfOfPots(): PotShelf {
    return this.shelf;
  }

  get output(): SeasonRows {
    return this.rows;
  }

  private writeObservations(): void {
    for (const o of this.plan.observations) {
      const trialIndex = o.trial ?? 0;
      const day = typeof o.day === 'string' ? o.day : this.firstRainFrom(o.day.firstRainFrom);
      const plot = o.plot ? this.plotsByTrial[trialIndex]!.find((p) => p.pair === o.plot!.pair && p.treatment === o.plot!.treatment) : undefined;
      this.pushObservation(this.trialIds[trialIndex]!, plot?.id ?? null, localTime(day, o.hour, this.rng.int(0, 50)), o.text);
    }
  }

  pushObservation(trialId: string, plotId: string | null, at: string, text: string): void {
    this.rows.observations.push({
      id: randomUUID(),
      trial_id: trialId,
      plot_id: plotId,
      observed_at: at,
      text,
      entered_by: this.ownerId,
      created_at: addMinutes(at, this.rng.int(1, 30)),
    });
  }

  private firstRainFrom(from: string): string {
    const day = [...this.weather.values()].find((w) => w.day >= from && w.rainMm >= 3)?.day;
    return day ?? from;
  }
}

/** One trial's days: weather, crop water use, pots, walks, picks. */
class TrialSeason {
  private readonly rng: Rng;
  private readonly forced = new Map<string, string>();
  private readonly cropId: CropId;
  /** The pot that cracks this season, if it is in this trial. */
  private readonly cracked: PotState | null;
  private lastFertilisedDay = -Infinity;

  constructor(
    private readonly garden: GardenSeason,
    private readonly tp: TrialPlan,
    private readonly trialId: string,
    private readonly plots: PlotSim[],
  ) {
    this.rng = new Rng(`trial:${tp.key}`);
    this.cropId = tp.crop as CropId;
    if (!CROP_COEFFICIENTS[this.cropId]) throw new Error(`The demo needs FAO-56 coefficients for ${tp.crop}.`);
    this.forced.set(tp.plantingDate, localTime(tp.plantingDate, 8, this.rng.int(0, 90)));
    this.forced.set(tp.lastLogDate, localTime(tp.lastLogDate, 7, this.rng.int(0, 60)));
    const crack = garden.grower.crackedPot;
    const inThisTrial = crack !== undefined && within(crack.day, { from: tp.plantingDate, to: tp.lastLogDate });
    this.cracked = inThisTrial ? (plots.find((p) => p.pair === crack.pair && p.treatment === 'olla')?.pots[0] ?? null) : null;
    if (inThisTrial) this.forced.set(crack.day, localTime(crack.day, 7, 10));
  }

  simulate(): void {
    for (const day of eachDay(this.tp.plantingDate, this.tp.lastLogDate)) {
      const d = daysBetween(this.tp.plantingDate, day);
      const w = this.garden.weatherOn(day);
      const { kc, stage } = kcForDay(this.cropId, d);
      const etcMm = w.et0Mm * kc;
      const effectiveRainMm = w.rainMm >= 2 ? 0.8 * w.rainMm : 0;
      // Ageing plants draw less from the pots as their Kc falls in the late season.
      const lateSeason = stage === 'late' || stage === 'after-season' ? Math.sqrt(kc / CROP_COEFFICIENTS[this.cropId].kcMid) : 1;
      if (d > 0) this.passDay(day, d, w, etcMm, effectiveRainMm, lateSeason);
      const walk = this.garden.walkOn(day, this.forced);
      if (walk) this.walk(day, d, walk);
    }
    this.pick();
  }

  /** A day and a night in the beds: plants drink, pots seep, rain falls. */
  private passDay(day: string, d: number, w: WeatherDay, etcMm: number, rainMm: number, lateSeason: number): void {
    const habits = this.garden.grower.habits;
    const est = this.tp.establishmentDays ?? habits.establishmentDays;
    // The cracked pot empties in the night before the morning it is found.
    const drainsTonight = this.cracked && day === this.garden.grower.crackedPot!.day ? this.cracked : null;
    for (const plot of this.plots) {
      // Water the grower owes the bed from above: the crop's use for surface beds; for olla beds a
      // tapering can for the seedlings until their roots reach the pots, then any habitual top-ups.
      const needMm =
        plot.treatment === 'surface' ? etcMm * groundCover(d) : d < est ? etcMm * (1 - d / est) : etcMm * groundCover(d) * (habits.ollaTopUpShare ?? 0);
      if (needMm > 0) plot.deficitMm = clamp(plot.deficitMm + needMm - rainMm, 0, 45);
      // The top soil dries by the crop's use and by evaporation from the wet surface alike.
      plot.wetness = clamp(plot.wetness - (etcMm / ROOT_ZONE_STORE_MM) * (0.4 + 0.6 * plot.wetness) + rainMm / ROOT_ZONE_STORE_MM, 0.02, 1);
      for (const pot of plot.pots) {
        const loss = pot === drainsTonight ? pot.contentL : Math.min(pot.contentL, this.potLossL(pot, d, w, lateSeason));
        pot.contentL -= loss;
        pot.lossByDay.set(day, loss);
      }
      const potsWorking = plot.pots.some((p) => p.contentL > 0.05);
      if (plot.treatment === 'olla' && potsWorking) plot.wetness += (OLLA_WETNESS - plot.wetness) * 0.45;
      if (plot.wetness < DRY_WETNESS || (plot.treatment === 'olla' && !potsWorking && d >= est)) plot.stressDays.add(day);
    }
  }

  private potLossL(pot: PotState, d: number, w: WeatherDay, lateSeason: number): number {
    const uptake = POT_UPTAKE.atPlanting + (POT_UPTAKE.full - POT_UPTAKE.atPlanting) * Math.min(1, d / POT_UPTAKE.daysToFull);
    const demand = (w.et0Mm / POT_UPTAKE.referenceEt0Mm) ** POT_UPTAKE.et0Exponent;
    const g = this.garden.grower.garden;
    return (
      pot.airLPerDay *
      SOILS[g.soil].seepFactor *
      SETTING_SEEP_FACTOR[this.tp.setting] *
      uptake *
      demand *
      lateSeason *
      (this.tp.lid ? 1 : POT_UPTAKE.lidlessFactor) *
      (w.rainMm >= 5 ? POT_UPTAKE.wetSoilFactor : 1) *
      this.rng.factor(0.05)
    );
  }

  /** One walk: read the probes first, then refill every pot and water the beds that need it. */
  private walk(day: string, d: number, walk: Walk): void {
    const m = this.tp.moisture;
    if (m && d > 0 && this.rng.chance(readingChance(this.garden.grower, m.perWeek))) {
      for (const plot of this.plots) this.pushReading(plot, addMinutes(walk.at, -12 + walk.step++), m);
    }
    const fertilise = this.tp.fertiliserEveryDays !== undefined && d >= 14 && d - this.lastFertilisedDay >= this.tp.fertiliserEveryDays;
    if (fertilise) this.lastFertilisedDay = d;
    if (this.cracked && day === this.garden.grower.crackedPot!.day) this.replaceCrackedPot(day, this.cracked);
    for (const plot of this.plots) {
      for (const pot of plot.pots) {
        const lost = pot.capacityL - pot.contentL;
        const note =
          d === 0
            ? 'First fill at planting.'
            : pot.installedOn === day
              ? `New pot ${pot.label} (replaces cracked ${this.cracked?.label ?? 'pot'}): first fill.`
              : '';
        // Topped up to the neck with a measuring jug: what it lost, read to 0.1 L.
        const litres = note ? pot.capacityL : round(Math.max(0.1, lost * this.rng.factor(0.03)), 1);
        if (lost >= 0.2) this.pushWater(plot, day, walk, 'olla_refill', litres, pot.id, fertilise && d > 0, note);
        pot.contentL = pot.capacityL;
      }
      this.waterFromAbove(plot, day, d, walk, fertilise);
    }
  }

  private waterFromAbove(plot: PlotSim, day: string, d: number, walk: Walk, fertilise: boolean): void {
    const habits = this.garden.grower.habits;
    let mm = 0;
    let note = '';
    if (d === 0) {
      mm = WATERING_IN_MM;
      note = 'Watered in at planting.';
    } else if (plot.deficitMm >= SURFACE_TRIGGER_MM) {
      mm = (plot.deficitMm * habits.surfaceHabit * plot.habit * this.rng.factor(0.08)) / SURFACE_EFFICIENCY;
    }
    if (mm <= 0) return;
    const litres = Math.max(0.5, roundTo(mm * plot.areaM2, 0.5));
    plot.deficitMm = 0;
    plot.wetness = clamp(plot.wetness + ((litres / plot.areaM2) * SURFACE_EFFICIENCY) / ROOT_ZONE_STORE_MM, 0, 1);
    this.pushWater(plot, day, walk, 'surface', litres, null, fertilise, note);
  }

  /** Found empty in the morning with a crack: it is lifted and a spare from the shelf goes in. */
  private replaceCrackedPot(day: string, cracked: PotState): void {
    const crack = this.garden.grower.crackedPot!;
    const plot = this.plots.find((p) => p.pots.includes(cracked))!;
    const spare = this.garden.shelfOfPots.byLabel(crack.replacementLabel);
    cracked.condition = 'cracked';
    cracked.plotId = null;
    cracked.notes = `${cracked.notes} ${crack.note.replace('{day}', day).replace('{spare}', spare.label)}`.trim();
    spare.plotId = plot.id;
    spare.installedOn = day;
    spare.contentL = 0;
    plot.pots[plot.pots.indexOf(cracked)] = spare;
  }

  private pushWater(plot: PlotSim, day: string, walk: Walk, kind: WaterKind, litres: number, potId: string | null, fertiliser: boolean, notes: string): void {
    const at = addMinutes(walk.at, walk.step++ * this.rng.int(1, 2));
    const wrong = this.garden.grower.wrongUnit;
    // The wrong-unit grower read a gallon jug and typed the number into the litre field.
    const logged = within(day, wrong) ? round(Math.max(0.05, roundTo(litres / LITRES_PER_US_GALLON, 0.05)), 2) : litres;
    const sources = this.garden.grower.sources;
    this.garden.output.water_events.push({
      id: randomUUID(),
      trial_id: this.trialId,
      plot_id: plot.id,
      entered_by: this.garden.owner,
      created_at: addMinutes(at, this.rng.int(1, 20)),
      occurred_at: at,
      kind,
      volume_l: logged,
      source: sourceOn(kind === 'olla_refill' ? sources.olla : sources.surface, day),
      fertiliser,
      pot_id: potId,
      notes,
    });
  }

  private pushReading(plot: PlotSim, at: string, m: NonNullable<TrialPlan['moisture']>): void {
    this.garden.output.moisture_readings.push({
      id: randomUUID(),
      trial_id: this.trialId,
      plot_id: plot.id,
      entered_by: this.garden.owner,
      created_at: addMinutes(at, this.rng.int(1, 15)),
      taken_at: at,
      method: m.method,
      depth_cm: m.depthCm,
      value: moistureValue(m.method, plot.wetness, this.garden.grower.garden.soil, this.rng),
    });
  }

  /** Picks from the first ripe fruit to the last day: each pick what the bed grew since the last one. */
  private pick(): void {
    if (!this.tp.harvestLogged) return;
    const profile = CROP_PROFILES[this.tp.crop];
    const first = addDays(this.tp.plantingDate, profile.daysToFirstPick + this.rng.int(-4, 4));
    const pairEffect = new Map(this.plots.map((p) => [p.pair, 0]));
    for (const pair of pairEffect.keys()) pairEffect.set(pair, this.rng.factor(0.12));
    const plotEffect = new Map(this.plots.map((p) => [p.id, (p.treatment === 'olla' ? this.tp.ollaYieldEffect : 1) * this.rng.factor(0.06)]));
    const dailyKgPerM2 = profile.seasonKgPerM2 / FULL_PICKING_DAYS;
    // Fruit ripens every day; a pick takes what is ripe, unless it is less than half a fruit.
    const ripeKg = new Map(this.plots.map((p) => [p.id, 0]));
    let previous = addDays(first, -profile.pickEveryDays[0]);
    const picks: { plot: PlotSim; day: string; kg: number }[] = [];
    for (let day = first; day <= this.tp.lastLogDate; day = addDays(day, this.rng.int(...profile.pickEveryDays))) {
      const interval = daysBetween(previous, day);
      const ramp = clamp(0.3 + daysBetween(first, day) / 14, 0.3, 1);
      for (const plot of this.plots) {
        const grown =
          dailyKgPerM2 *
          plot.areaM2 *
          interval *
          ramp *
          blossomDrop(this.tp.crop, day) *
          waterStress(plot, day) *
          pairEffect.get(plot.pair)! *
          plotEffect.get(plot.id)! *
          this.rng.factor(0.25);
        const kg = ripeKg.get(plot.id)! + grown;
        if (kg >= profile.fruitKg * 0.5) {
          picks.push({ plot, day, kg: round(kg, 2) });
          ripeKg.set(plot.id, 0);
        } else ripeKg.set(plot.id, kg);
      }
      previous = day;
    }
    for (const { plot, day, kg } of picks) this.pushHarvest(plot, day, kg, profile);
    this.correctTypo(picks);
  }

  private pushHarvest(plot: PlotSim, day: string, kg: number, profile: (typeof CROP_PROFILES)[keyof typeof CROP_PROFILES]): void {
    const count = profile.fruitKg < 0.05 ? null : Math.max(1, Math.round((kg / profile.fruitKg) * this.rng.factor(0.1)));
    const at = localTime(day, 10, this.rng.int(0, 90));
    this.garden.output.harvests.push({
      id: randomUUID(),
      trial_id: this.trialId,
      plot_id: plot.id,
      entered_by: this.garden.owner,
      created_at: at,
      harvested_on: day,
      fresh_kg: kg,
      count,
      marketable_kg: round(kg * this.rng.uniform(...profile.marketableShare), 2),
      notes: '',
    });
  }

  /** A pick first typed ten times too large and corrected after the trial was shared: an audit entry and a note. */
  private correctTypo(picks: { plot: PlotSim; day: string }[]): void {
    const fix = this.garden.grower.harvestCorrection;
    if (!fix) return;
    const plot = this.plots.find((p) => p.pair === fix.pair && p.treatment === fix.treatment)!;
    const rows = this.garden.output.harvests.filter((h) => h.plot_id === plot.id);
    if (!picks.length || !rows.length) return;
    const distance = (h: (typeof rows)[number]) => Math.abs(daysBetween(fix.near, h.harvested_on as string));
    const row = rows.reduce((best, h) => (distance(h) < distance(best) ? h : best));
    const kg = row.fresh_kg as number;
    const at = localTime(addDays(row.harvested_on as string, 2), 20, 5);
    this.garden.output.audit_entries.push({
      id: randomUUID(),
      trial_id: this.trialId,
      actor_id: this.garden.owner,
      at,
      action: 'update',
      entity_type: 'harvest',
      entity_id: row.id,
      changes: JSON.stringify({ freshKg: [round(kg * 10, 1), kg] }),
    });
    this.garden.pushObservation(
      this.trialId,
      plot.id,
      addMinutes(at, 2),
      `Fixed a typo in the ${row.harvested_on as string} pick on this bed: ${round(kg * 10, 1)} kg should have been ${kg} kg.`,
    );
  }
}

/** The grower's usual walks: every 1-3 days, daily in the heat wave if that is their habit, none while away. */
function walkTimes(plan: GrowerPlan, from: string, to: string): Map<string, string> {
  const rng = new Rng(`walks:${plan.email}`);
  const h = plan.habits;
  const out = new Map<string, string>();
  let day = from;
  while (day <= to) {
    if (h.away && within(day, h.away)) {
      day = addDays(h.away.to, 1);
      continue;
    }
    const evening = rng.chance(h.eveningShare);
    out.set(day, evening ? localTime(day, 18, rng.int(0, 105)) : localTime(day, 6, 30 + rng.int(0, 105)));
    let gap = h.dailyInHeatWave && within(addDays(day, 1), CLIMATE.heatWave) ? 1 : rng.weighted([1, 2, 3], h.walkIntervalWeights);
    if (rng.chance(h.missChance)) gap += 1;
    day = addDays(day, gap);
  }
  return out;
}

/** Chance of taking readings on a walk so that they come about `perWeek` times a week. */
function readingChance(plan: GrowerPlan, perWeek: number): number {
  const [w1, w2, w3] = plan.habits.walkIntervalWeights;
  const meanGap = (w1 + 2 * w2 + 3 * w3) / (w1 + w2 + w3);
  return Math.min(1, (perWeek * meanGap) / 7);
}

function sourceOn(rule: SourceRule, day: string) {
  return rule.periods?.find((p) => within(day, p))?.source ?? rule.usual;
}

/** Tomatoes and peppers drop blossoms in a heat wave: fewer fruit to pick two to four weeks later. */
function blossomDrop(crop: string, day: string): number {
  if (crop !== 'tomato' && crop !== 'sweet-pepper') return 1;
  return within(day, { from: addDays(CLIMATE.heatWave.from, 18), to: addDays(CLIMATE.heatWave.to, 30) }) ? 0.65 : 1;
}

/** Dry days one to four weeks before a pick cost fruit. */
function waterStress(plot: PlotSim, day: string): number {
  let dry = 0;
  for (let back = 7; back <= 28; back++) if (plot.stressDays.has(addDays(day, -back))) dry += 1;
  return Math.max(0.5, 1 - 0.025 * dry);
}
