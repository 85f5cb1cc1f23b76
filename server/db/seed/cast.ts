/**
 * Who grows what in the Saltbush Bend Garden Network's 2026 season. Every person, garden,
 * place, coordinate and note here is invented for the demo; the numbers the screens show are
 * generated from these plans by season.ts and then computed by the real analysis.
 */
import type { ConeId } from '@shared/agronomy/pyrometric-cones';
import type { SoilTexture } from '@shared/schemas/gardens';
import type { MoistureMethod, WaterSource } from '@shared/schemas/logs';
import type { PlotSetting } from '@shared/schemas/plots';
import type { ClayBody, PotCondition, PotMake, PotShape, SeepSetting } from '@shared/schemas/pots';
import type { Crop } from '@shared/schemas/trials';

export interface PotRecipe {
  shape: PotShape;
  make: PotMake;
  clayBody: ClayBody;
  firingCone: ConeId | null;
  /** Capacities drawn uniformly from this range, rounded to 0.5 L. */
  capacityL: readonly [number, number];
  notes: string;
  /** A matched set from one batch: the pots seep almost alike. */
  matchedSet?: boolean;
}

/** A pot on the shelf that is not in a bed at the start of the season. */
export interface SparePot {
  label: string;
  recipe: PotRecipe;
  capacityL: number;
  condition: PotCondition;
  notes: string;
  /** Seep tests with given results (litres per day); without them the pot gets a spring test in air. */
  tests?: { testedOn: string; setting: SeepSetting; hours: number; litresPerDay: number; notes: string }[];
}

export interface SourceRule {
  usual: WaterSource;
  periods?: { from: string; to: string; source: WaterSource }[];
}

export interface ObservationPlan {
  /** A day, or the first day from the given day with at least 3 mm of rain at the garden. */
  day: string | { firstRainFrom: string };
  hour: number;
  text: string;
  /** Which of the grower's trials (default the first). */
  trial?: number;
  /** A note about one plot, named by pair number and treatment (resolved after randomisation). */
  plot?: { pair: number; treatment: 'olla' | 'surface' };
}

export interface TrialPlan {
  key: string;
  title: string;
  crop: Crop;
  variety: string;
  question: string;
  plantingDate: string;
  /** Closed trials end on this date; active ones have none. */
  endDate: string | null;
  /** The last day anything was logged (the end date for closed trials). */
  lastLogDate: string;
  status: 'active' | 'closed';
  /** Area of both plots of each pair, m² (one entry per pair). */
  pairAreasM2: readonly number[];
  setting: PlotSetting;
  mulch: boolean;
  lid: boolean;
  /** Pots in each olla plot. */
  potsPerOllaPlot: 1 | 2;
  /** The day the trial was shared into the network (absent: kept private). */
  sharedOn?: string;
  harvestLogged: boolean;
  /** How the olla plots' harvest compares with their surface partner on average (1 = same). */
  ollaYieldEffect: number;
  moisture?: { method: MoistureMethod; depthCm: number; perWeek: number };
  kcOverrides?: { ini?: number; mid?: number; end?: number };
  /** A 48-hour seep test in the bed, mid-season, for every pot of the trial. */
  inBedSeepTestOn?: string;
  /** Overrides the grower's usual establishment days (e.g. a direct-sown crop). */
  establishmentDays?: number;
  /** Fertiliser with the water every this many days (both treatments). */
  fertiliserEveryDays?: number;
}

export interface GrowerPlan {
  email: string;
  /** Pot labels are this prefix and a number (T1, T2, …). */
  potPrefix: string;
  garden: {
    name: string;
    latitudeDeg: number;
    longitudeDeg: number;
    elevationM: number;
    soil: SoilTexture;
    notes: string;
    /** Logs humidity, wind and sunshine too (Penman-Monteith) rather than only min/max (Hargreaves). */
    station: boolean;
    microclimateC: number;
  };
  habits: {
    /** Relative chance of 1, 2 or 3 days between walks. */
    walkIntervalWeights: readonly [number, number, number];
    eveningShare: number;
    dailyInHeatWave: boolean;
    /** Chance that a walk slips by a day. */
    missChance: number;
    away?: { from: string; to: string };
    /** Surface water given relative to the crop's need since the last watering (1 = matches ETc / efficiency). */
    surfaceHabit: number;
    /** Days the olla plots' seedlings are also watered from above, tapering off. */
    establishmentDays: number;
    /** After establishment, the share of the crop's need the grower still gives olla beds from above (default none). */
    ollaTopUpShare?: number;
    seepTest: { setting: SeepSetting; hours: number };
  };
  sources: { olla: SourceRule; surface: SourceRule };
  potRecipe: PotRecipe;
  trials: TrialPlan[];
  spares?: SparePot[];
  /** One pot cracks: it drains in the night before the morning of `day`, is lifted then and a spare goes in. */
  /** `note` is added to the cracked pot's notes in the grower's language; {day} and {spare} are filled in. */
  crackedPot?: { day: string; pair: number; replacementLabel: string; note: string };
  /** Weeks in which the grower typed gallons into the litre field. */
  wrongUnit?: { from: string; to: string };
  /** Forecast days after the last observed day, optionally with a frost night. */
  forecast?: { days: number; frost?: { day: string; tMinC: number } };
  /** A harvest typo corrected after sharing (recorded in the audit trail). */
  harvestCorrection?: { near: string; pair: number; treatment: 'olla' | 'surface' };
  observations: ObservationPlan[];
}

export const DEMO_PROTOCOL = [
  'Pairs of matched beds, same crop and planting day; which bed of a pair gets the pots was drawn at random (seed recorded).',
  'Olla beds: refill every pot to the neck on each walk and log the litres it took. Surface beds: water with a can or metered hose when the top few centimetres are dry and log the litres.',
  'Weigh every pick per bed. Note pests, damage and anything unusual.',
].join('\n');

const CRAFT_FAIR_GLOBE: PotRecipe = {
  shape: 'globe',
  make: 'wheel_thrown',
  clayBody: 'earthenware',
  firingCone: '04',
  capacityL: [9, 11],
  notes: 'Thrown by a potter at the spring craft fair; red earthenware.',
};

export const GROWERS: GrowerPlan[] = [
  {
    email: 'ruth@saltbush.example',
    potPrefix: 'B',
    garden: {
      name: 'Mesquite Lane yard',
      latitudeDeg: 35.2,
      longitudeDeg: -105.4,
      elevationM: 1470,
      soil: 'loam',
      notes: 'South-facing beds behind the house. Small weather station on the shed roof (humidity, wind at 2 m, sunshine recorder).',
      station: true,
      microclimateC: 0.3,
    },
    habits: {
      walkIntervalWeights: [0.25, 0.6, 0.15],
      eveningShare: 0.3,
      dailyInHeatWave: true,
      missChance: 0.03,
      surfaceHabit: 0.9,
      establishmentDays: 21,
      ollaTopUpShare: 0.1,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: CRAFT_FAIR_GLOBE,
    trials: [
      {
        key: 'ruth-tomato',
        title: 'South bed tomatoes: ollas or the can?',
        crop: 'tomato',
        variety: 'Paste tomato, saved seed',
        question: 'Do two buried pots per bed grow as many tomatoes as the watering can, on less water?',
        plantingDate: '2026-05-02',
        endDate: '2026-09-20',
        lastLogDate: '2026-09-20',
        status: 'closed',
        pairAreasM2: [2, 2, 2, 2],
        setting: 'in_ground',
        mulch: true,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-06',
        harvestLogged: true,
        ollaYieldEffect: 1.04,
        moisture: { method: 'vwc', depthCm: 15, perWeek: 3 },
        inBedSeepTestOn: '2026-07-08',
      },
      {
        key: 'ruth-beans',
        title: 'Late green beans in the small beds (trying it out)',
        crop: 'green-beans',
        variety: 'Bush bean, flat pod',
        question: 'Is a late sowing worth it with one small pot per bed?',
        plantingDate: '2026-08-08',
        endDate: null,
        lastLogDate: '2026-08-24',
        status: 'active',
        pairAreasM2: [1, 1],
        setting: 'raised_bed',
        mulch: false,
        lid: true,
        potsPerOllaPlot: 1,
        harvestLogged: true,
        ollaYieldEffect: 1,
        establishmentDays: 10,
      },
    ],
    spares: [{ label: 'B-spare', recipe: CRAFT_FAIR_GLOBE, capacityL: 9, condition: 'sound', notes: 'Spare from the same potter.' }],
    observations: [
      { day: '2026-05-02', hour: 9, text: 'Planted 16 seedlings, two per bed. Pots buried to the neck and filled; watered everything in.' },
      { day: '2026-07-15', hour: 7, text: 'Heat wave this week. Walking the beds every morning; the pots were down by about half each day.' },
      { day: '2026-08-03', hour: 8, text: 'Hornworm damage on this bed. Picked off two big ones.', plot: { pair: 3, treatment: 'surface' } },
      { day: '2026-08-08', hour: 9, text: 'Beans sown in the two small raised beds, one pot in each olla bed. Just for me this time.', trial: 1 },
    ],
  },
  {
    email: 'tomas@saltbush.example',
    potPrefix: 'T',
    garden: {
      name: 'Huerta del arroyo seco',
      latitudeDeg: 35.1,
      longitudeDeg: -105.3,
      elevationM: 1420,
      soil: 'sandy_loam',
      notes: 'Huerta junto al arroyo. Dos bidones de lluvia de 200 L. Termómetro de máxima y mínima.',
      station: false,
      microclimateC: 0,
    },
    habits: {
      walkIntervalWeights: [0.35, 0.5, 0.15],
      eveningShare: 0.7,
      dailyInHeatWave: true,
      missChance: 0.04,
      surfaceHabit: 0.9,
      establishmentDays: 24,
      ollaTopUpShare: 0.2,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: {
      olla: { usual: 'rainwater', periods: [{ from: '2026-06-19', to: '2026-08-04', source: 'mains' }] },
      surface: { usual: 'rainwater', periods: [{ from: '2026-06-19', to: '2026-08-04', source: 'mains' }] },
    },
    potRecipe: {
      shape: 'globe',
      make: 'coil_built',
      clayBody: 'mixed',
      firingCone: '06',
      capacityL: [7, 9],
      notes: 'Hecha a mano en el taller del barrio; barro local con arena.',
    },
    trials: [
      {
        key: 'tomas-squash',
        title: 'Calabacitas: ollas contra regadera',
        crop: 'squash-zucchini',
        variety: 'Calabacita gris criolla',
        question: '¿Cuánta agua ahorran las ollas en calabacitas, y se cosecha lo mismo?',
        plantingDate: '2026-05-11',
        endDate: '2026-09-12',
        lastLogDate: '2026-09-12',
        status: 'closed',
        pairAreasM2: [3, 3, 3],
        setting: 'in_ground',
        mulch: false,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-15',
        harvestLogged: true,
        ollaYieldEffect: 0.97,
        moisture: { method: 'probe_index', depthCm: 10, perWeek: 2 },
        inBedSeepTestOn: '2026-07-13',
      },
    ],
    spares: [
      {
        label: 'R1',
        recipe: { shape: 'globe', make: 'coil_built', clayBody: 'mixed', firingCone: '06', capacityL: [9, 9], notes: '' },
        capacityL: 9,
        condition: 'sound',
        notes: 'Olla de repuesto, del mismo taller.',
      },
    ],
    crackedPot: {
      day: '2026-07-21',
      pair: 2,
      replacementLabel: 'R1',
      note: 'El {day} apareció una grieta fina junto al cuello: se vació durante la noche. La saqué; {spare} ocupó su lugar.',
    },
    observations: [
      { day: '2026-05-11', hour: 9, text: 'Trasplanté las calabacitas y enterré las ollas. Regué todo a mano para asentar.' },
      {
        day: '2026-05-24',
        hour: 19,
        text: 'Las plantas de las parcelas con olla se ven algo mustias por la tarde; sigo regándolas por encima hasta que las raíces lleguen a la olla.',
      },
      {
        day: '2026-07-21',
        hour: 7,
        text: 'La olla T3 amaneció vacía: tiene una grieta fina junto al cuello. La saqué y puse la de repuesto (R1). Desde hoy los rellenos de esta parcela son de la R1.',
        plot: { pair: 2, treatment: 'olla' },
      },
      {
        day: '2026-08-12',
        hour: 19,
        text: 'Chinches en el envés de las hojas en las dos parcelas de este par. Las quité a mano.',
        plot: { pair: 1, treatment: 'surface' },
      },
    ],
  },
  {
    email: 'ines@saltbush.example',
    potPrefix: 'I',
    garden: {
      name: 'Patio de la calle Alcaraván',
      latitudeDeg: 35.3,
      longitudeDeg: -105.2,
      elevationM: 1530,
      soil: 'silt_loam',
      notes: 'Bancales elevados en un patio cerrado. Estación meteorológica pequeña en la pared norte.',
      station: true,
      microclimateC: 0.5,
    },
    habits: {
      walkIntervalWeights: [0.5, 0.45, 0.05],
      eveningShare: 0.5,
      dailyInHeatWave: true,
      missChance: 0.02,
      surfaceHabit: 0.9,
      establishmentDays: 21,
      seepTest: { setting: 'saturated_sand', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'bottle',
      make: 'slip_cast',
      clayBody: 'earthenware',
      firingCone: '05',
      capacityL: [6, 7],
      notes: 'Comprada; botella de colada, boca estrecha.',
    },
    trials: [
      {
        key: 'ines-pepper',
        title: 'Pimientos en bancales: olla o riego',
        crop: 'sweet-pepper',
        variety: 'Pimiento morrón rojo',
        question: '¿Con dos ollas pequeñas por bancal se mantienen los pimientos sin estrés?',
        plantingDate: '2026-05-16',
        endDate: '2026-09-26',
        lastLogDate: '2026-09-26',
        status: 'closed',
        pairAreasM2: [1.5, 1.5, 1.5],
        setting: 'raised_bed',
        mulch: true,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-20',
        harvestLogged: true,
        ollaYieldEffect: 1.06,
        moisture: { method: 'tensiometer', depthCm: 20, perWeek: 3 },
        inBedSeepTestOn: '2026-07-21',
        fertiliserEveryDays: 14,
      },
    ],
    observations: [
      {
        day: '2026-06-10',
        hour: 8,
        text: 'Pulgones en los pimientos de este bancal; jabón potásico en las dos parcelas del par.',
        plot: { pair: 2, treatment: 'olla' },
      },
      { day: '2026-07-17', hour: 19, text: 'Ola de calor: los tensiómetros de las parcelas regadas por encima pasan de 50 kPa por la tarde.' },
      { day: '2026-09-26', hour: 9, text: 'Cerré el ensayo y saqué las ollas antes de las heladas.' },
    ],
  },
  {
    email: 'wendell@saltbush.example',
    potPrefix: 'W',
    garden: {
      name: 'Cottonwood Row backyard',
      latitudeDeg: 35.2,
      longitudeDeg: -105.2,
      elevationM: 1400,
      soil: 'clay_loam',
      notes: 'Heavy ground, double-dug in March. Min/max thermometer by the back door.',
      station: false,
      microclimateC: -0.3,
    },
    habits: {
      walkIntervalWeights: [0, 1, 0],
      eveningShare: 0,
      dailyInHeatWave: false,
      missChance: 0,
      surfaceHabit: 1.0,
      establishmentDays: 14,
      seepTest: { setting: 'air', hours: 48 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'bottle',
      make: 'wheel_thrown',
      clayBody: 'earthenware',
      firingCone: '05',
      capacityL: [10, 10],
      notes: 'One of a matched set of eight from the same potter.',
      matchedSet: true,
    },
    trials: [
      {
        key: 'wendell-tomato',
        title: 'Backyard tomatoes, pots vs hose',
        crop: 'tomato',
        variety: 'Beefsteak type',
        question: 'Same tomatoes, a third of the water?',
        plantingDate: '2026-04-28',
        endDate: '2026-09-15',
        lastLogDate: '2026-09-15',
        status: 'closed',
        pairAreasM2: [2.5, 2.5, 2.5, 2.5],
        setting: 'in_ground',
        mulch: false,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-01',
        harvestLogged: true,
        ollaYieldEffect: 0.96,
      },
    ],
    wrongUnit: { from: '2026-08-03', to: '2026-08-23' },
    observations: [
      { day: '2026-05-20', hour: 7, text: 'Surface beds get the hose through a flow meter; the pots get topped up from the gallon jug.' },
      { day: '2026-07-30', hour: 7, text: 'Blossom drop on all eight beds after the hot spell.' },
    ],
  },
  {
    email: 'priya@saltbush.example',
    potPrefix: 'P',
    garden: {
      name: 'Back patio containers',
      latitudeDeg: 35.3,
      longitudeDeg: -105.3,
      elevationM: 1510,
      soil: 'sandy_loam',
      notes: 'Half-barrel containers on a paved patio, potting mix over sandy loam. Weather station on the fence post.',
      station: true,
      microclimateC: 0.8,
    },
    habits: {
      walkIntervalWeights: [0.6, 0.35, 0.05],
      eveningShare: 0.8,
      dailyInHeatWave: true,
      missChance: 0.05,
      surfaceHabit: 0.75,
      establishmentDays: 14,
      ollaTopUpShare: 0.2,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'twin_pot',
      make: 'joined_terracotta',
      clayBody: 'terracotta',
      firingCone: null,
      capacityL: [5, 6],
      notes: 'Two terracotta flower pots glued rim to rim; top hole plugged with a cork lid.',
    },
    trials: [
      {
        key: 'priya-pepper',
        title: 'Container peppers on the back patio',
        crop: 'sweet-pepper',
        variety: 'Mini bell, mixed colours',
        question: 'Do ollas help in containers that dry out every afternoon?',
        plantingDate: '2026-05-20',
        endDate: null,
        lastLogDate: '2026-09-27',
        status: 'active',
        pairAreasM2: [1, 1],
        setting: 'container',
        mulch: false,
        lid: false,
        potsPerOllaPlot: 1,
        sharedOn: '2026-06-01',
        harvestLogged: true,
        ollaYieldEffect: 0.93,
        moisture: { method: 'vwc', depthCm: 15, perWeek: 2 },
      },
    ],
    forecast: { days: 5, frost: { day: '2026-10-01', tMinC: -1.2 } },
    observations: [
      { day: '2026-06-03', hour: 19, text: 'The containers dry out fast in the wind; the can plots need water nearly every day.' },
      { day: '2026-09-27', hour: 19, text: 'Frost forecast for Thursday night. Will pick what is left and lift the pots on Wednesday.' },
    ],
  },
  {
    email: 'odalys@saltbush.example',
    potPrefix: 'X',
    garden: {
      name: 'Sand Hollow lot',
      latitudeDeg: 35.0,
      longitudeDeg: -105.4,
      elevationM: 1350,
      soil: 'sand',
      notes: 'Open lot on blow sand; compost dug into each bed. Min/max thermometer.',
      station: false,
      microclimateC: 0.2,
    },
    habits: {
      walkIntervalWeights: [0.45, 0.45, 0.1],
      eveningShare: 0.4,
      dailyInHeatWave: true,
      missChance: 0.03,
      surfaceHabit: 1.0,
      establishmentDays: 21,
      ollaTopUpShare: 0.25,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'cylinder',
      make: 'coil_built',
      clayBody: 'earthenware',
      firingCone: '06',
      capacityL: [12, 15],
      notes: 'Tall coil-built cylinder, low-fired.',
    },
    trials: [
      {
        key: 'odalys-melon',
        title: 'Melons on sand: can the pots keep up?',
        crop: 'sweet-melon',
        variety: 'Cantaloupe type, netted',
        question: 'On fast-draining sand, do big pots keep melons watered with less water?',
        plantingDate: '2026-05-23',
        endDate: '2026-09-08',
        lastLogDate: '2026-09-08',
        status: 'closed',
        pairAreasM2: [4, 4, 4],
        setting: 'in_ground',
        mulch: true,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-28',
        harvestLogged: false,
        ollaYieldEffect: 1,
        inBedSeepTestOn: '2026-07-22',
      },
    ],
    observations: [
      { day: '2026-08-18', hour: 8, text: 'First four ripe melons picked, but the scale is still at my sister’s. Will weigh the next ones.' },
      { day: '2026-09-01', hour: 8, text: 'Still no scale; the melons went to the neighbours unweighed. No harvest weights this year, sorry.' },
      { day: '2026-09-08', hour: 9, text: 'Closing the trial. The water records are complete.' },
    ],
  },
  {
    email: 'bram@saltbush.example',
    potPrefix: 'D',
    garden: {
      name: 'Kettleson raised beds',
      latitudeDeg: 35.2,
      longitudeDeg: -105.3,
      elevationM: 1460,
      soil: 'silt_loam',
      notes: 'Ten timber raised beds. Laundry greywater line to the surface beds. Weather station on the garage.',
      station: true,
      microclimateC: 0.2,
    },
    habits: {
      walkIntervalWeights: [0.4, 0.5, 0.1],
      eveningShare: 0.6,
      dailyInHeatWave: true,
      missChance: 0.03,
      surfaceHabit: 0.9,
      establishmentDays: 21,
      ollaTopUpShare: 0.15,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'greywater' } },
    potRecipe: {
      shape: 'twin_pot',
      make: 'joined_terracotta',
      clayBody: 'terracotta',
      firingCone: null,
      capacityL: [6, 8],
      notes: 'Two terracotta pots joined with silicone; bottom hole sealed.',
    },
    trials: [
      {
        key: 'bram-tomato',
        title: 'Cherry tomatoes in five raised beds',
        crop: 'tomato',
        variety: 'Red cherry',
        question: 'One twin pot per bed against greywater from the can: yield and water.',
        plantingDate: '2026-04-30',
        endDate: '2026-09-22',
        lastLogDate: '2026-09-22',
        status: 'closed',
        pairAreasM2: [1, 1, 1, 1, 1],
        setting: 'raised_bed',
        mulch: true,
        lid: true,
        potsPerOllaPlot: 1,
        sharedOn: '2026-05-04',
        harvestLogged: true,
        ollaYieldEffect: 1.02,
        moisture: { method: 'vwc', depthCm: 15, perWeek: 3 },
        inBedSeepTestOn: '2026-07-07',
      },
    ],
    spares: [
      {
        label: 'D-jug',
        recipe: { shape: 'bottle', make: 'wheel_thrown', clayBody: 'stoneware', firingCone: '6', capacityL: [6, 6], notes: '' },
        capacityL: 6,
        condition: 'retired',
        notes: 'Stoneware jug from a yard sale. Fired far too hot for an olla: it barely seeps.',
        tests: [{ testedOn: '2026-04-05', setting: 'air', hours: 48, litresPerDay: 0.04, notes: 'Level hardly moved in two days.' }],
      },
      {
        label: 'D-old',
        recipe: { shape: 'twin_pot', make: 'joined_terracotta', clayBody: 'terracotta', firingCone: null, capacityL: [7, 7], notes: '' },
        capacityL: 7,
        condition: 'clogged',
        notes: 'Filled with greywater in 2025; the pores clogged. Keeps it for comparison.',
        tests: [
          { testedOn: '2025-04-12', setting: 'air', hours: 24, litresPerDay: 0.62, notes: 'New.' },
          { testedOn: '2026-04-05', setting: 'air', hours: 24, litresPerDay: 0.21, notes: 'After a season of greywater: a third of last year.' },
        ],
      },
    ],
    harvestCorrection: { near: '2026-08-18', pair: 2, treatment: 'olla' },
    observations: [
      {
        day: '2026-05-01',
        hour: 19,
        text: 'Greywater (laundry rinse) for the surface beds only. The pots get mains water: greywater clogged last year’s pot.',
      },
      { day: '2026-07-30', hour: 19, text: 'Hornworms on both beds of this pair. Picked off six.', plot: { pair: 3, treatment: 'olla' } },
    ],
  },
  {
    email: 'lupe@saltbush.example',
    potPrefix: 'F',
    garden: {
      name: 'Arrowood side yard',
      latitudeDeg: 35.1,
      longitudeDeg: -105.5,
      elevationM: 1380,
      soil: 'loamy_sand',
      notes: 'Narrow side yard, room for two beds. Min/max thermometer.',
      station: false,
      microclimateC: 0.4,
    },
    habits: {
      walkIntervalWeights: [0.4, 0.5, 0.1],
      eveningShare: 0.5,
      dailyInHeatWave: true,
      missChance: 0.04,
      surfaceHabit: 0.9,
      establishmentDays: 21,
      ollaTopUpShare: 0.1,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'globe',
      make: 'wheel_thrown',
      clayBody: 'earthenware',
      firingCone: '04',
      capacityL: [12, 12],
      notes: 'Large globe from the craft fair.',
    },
    trials: [
      {
        key: 'lupe-squash',
        title: 'Una pareja de calabacines',
        crop: 'squash-zucchini',
        variety: 'Calabacín verde oscuro',
        question: '¿Se nota la olla en un patio pequeño?',
        plantingDate: '2026-05-12',
        endDate: '2026-09-05',
        lastLogDate: '2026-09-05',
        status: 'closed',
        pairAreasM2: [2],
        setting: 'in_ground',
        mulch: false,
        lid: true,
        potsPerOllaPlot: 1,
        sharedOn: '2026-05-20',
        harvestLogged: true,
        ollaYieldEffect: 1.05,
      },
    ],
    observations: [
      { day: '2026-05-12', hour: 9, text: 'Solo cabe un par este año. Sé que con un par no hay prueba estadística; lo registro igual para la red.' },
    ],
  },
  {
    email: 'caspian@saltbush.example',
    potPrefix: 'L',
    garden: {
      name: 'Mesa top lot',
      latitudeDeg: 35.4,
      longitudeDeg: -105.2,
      elevationM: 1620,
      soil: 'sandy_clay_loam',
      notes: 'Windy lot on the mesa, rain tank off the shed roof. Weather station on a 2 m mast.',
      station: true,
      microclimateC: -0.6,
    },
    habits: {
      walkIntervalWeights: [0.2, 0.5, 0.3],
      eveningShare: 0.5,
      dailyInHeatWave: false,
      missChance: 0.05,
      surfaceHabit: 1.1,
      establishmentDays: 21,
      ollaTopUpShare: 0.1,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'rainwater' }, surface: { usual: 'rainwater' } },
    potRecipe: {
      shape: 'cylinder',
      make: 'slip_cast',
      clayBody: 'earthenware',
      firingCone: '05',
      capacityL: [14, 15],
      notes: 'Slip-cast cylinder, bought by mail.',
    },
    trials: [
      {
        key: 'caspian-melon',
        title: 'Melons on the mesa lot',
        crop: 'sweet-melon',
        variety: 'Honeydew type',
        question: 'Big pots, windy site: how much of the hose water do they save?',
        plantingDate: '2026-05-26',
        endDate: '2026-09-14',
        lastLogDate: '2026-09-14',
        status: 'closed',
        pairAreasM2: [3, 3],
        setting: 'in_ground',
        mulch: false,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-06-02',
        harvestLogged: true,
        ollaYieldEffect: 1.08,
        kcOverrides: { mid: 1.0 },
        inBedSeepTestOn: '2026-07-15',
      },
    ],
    observations: [
      {
        day: '2026-06-14',
        hour: 19,
        text: 'The wind took the lid off a pot in this bed; a beetle had drowned inside. Lids now weighted with a stone.',
        plot: { pair: 1, treatment: 'olla' },
      },
    ],
  },
  {
    email: 'nettie@saltbush.example',
    potPrefix: 'N',
    garden: {
      name: 'Vance-Orozco raised beds',
      latitudeDeg: 35.3,
      longitudeDeg: -105.4,
      elevationM: 1550,
      soil: 'silty_clay_loam',
      notes: 'Three pairs of raised beds with straw mulch. Min/max thermometer.',
      station: false,
      microclimateC: 0,
    },
    habits: {
      walkIntervalWeights: [0.3, 0.55, 0.15],
      eveningShare: 0.2,
      dailyInHeatWave: true,
      missChance: 0.03,
      away: { from: '2026-08-08', to: '2026-08-11' },
      surfaceHabit: 0.9,
      establishmentDays: 21,
      ollaTopUpShare: 0.2,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'bottle',
      make: 'wheel_thrown',
      clayBody: 'earthenware',
      firingCone: '05',
      capacityL: [7, 8],
      notes: 'Bottle olla with a narrow neck.',
    },
    trials: [
      {
        key: 'nettie-tomato',
        title: 'Raised-bed tomatoes under straw',
        crop: 'tomato',
        variety: 'Pink heirloom',
        question: 'With mulch on every bed, do the pots still save water?',
        plantingDate: '2026-05-05',
        endDate: '2026-09-18',
        lastLogDate: '2026-09-18',
        status: 'closed',
        pairAreasM2: [2, 2, 2],
        setting: 'raised_bed',
        mulch: true,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-12',
        harvestLogged: true,
        ollaYieldEffect: 1,
        moisture: { method: 'vwc', depthCm: 15, perWeek: 2 },
      },
    ],
    observations: [
      { day: '2026-08-12', hour: 8, text: 'Back from four days away; the neighbour forgot. Pots bone dry, surface beds wilted. Both treatments took a hit.' },
    ],
  },
  {
    email: 'idris@saltbush.example',
    potPrefix: 'S',
    garden: {
      name: 'Calloway garden',
      latitudeDeg: 35.2,
      longitudeDeg: -105.1,
      elevationM: 1440,
      soil: 'clay',
      notes: 'Heavy adobe clay, amended with compost. Weather station by the gate.',
      station: true,
      microclimateC: 0,
    },
    habits: {
      walkIntervalWeights: [0.35, 0.5, 0.15],
      eveningShare: 0.6,
      dailyInHeatWave: true,
      missChance: 0.04,
      surfaceHabit: 0.85,
      establishmentDays: 21,
      ollaTopUpShare: 0.22,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'globe',
      make: 'coil_built',
      clayBody: 'earthenware',
      firingCone: '06',
      capacityL: [11, 13],
      notes: 'Coil-built globe, pit-fired then kiln-fired.',
    },
    trials: [
      {
        key: 'idris-squash',
        title: 'Summer squash in heavy clay',
        crop: 'squash-zucchini',
        variety: 'Yellow crookneck',
        question: 'Does slow clay soil make the pots less useful?',
        plantingDate: '2026-05-14',
        endDate: null,
        lastLogDate: '2026-09-27',
        status: 'active',
        pairAreasM2: [2, 2, 2],
        setting: 'in_ground',
        mulch: true,
        lid: true,
        potsPerOllaPlot: 2,
        harvestLogged: true,
        ollaYieldEffect: 0.98,
      },
    ],
    spares: [
      {
        label: 'S-spare',
        recipe: { shape: 'globe', make: 'coil_built', clayBody: 'earthenware', firingCone: '06', capacityL: [12, 12], notes: '' },
        capacityL: 12,
        condition: 'sound',
        notes: 'Spare.',
      },
    ],
    forecast: { days: 4 },
    observations: [{ day: '2026-08-02', hour: 19, text: 'Squash bugs under the leaves in this pair, both treatments.', plot: { pair: 1, treatment: 'olla' } }],
  },
  {
    email: 'maren@saltbush.example',
    potPrefix: 'V',
    garden: {
      name: 'Fence-line beds, lower town',
      latitudeDeg: 35.1,
      longitudeDeg: -105.2,
      elevationM: 1290,
      soil: 'silty_clay',
      notes: 'Beds along the south fence in the lower, warmer part of town. Min/max thermometer.',
      station: false,
      microclimateC: 0.4,
    },
    habits: {
      walkIntervalWeights: [0.3, 0.5, 0.2],
      eveningShare: 0.5,
      dailyInHeatWave: true,
      missChance: 0.03,
      surfaceHabit: 0.9,
      establishmentDays: 21,
      ollaTopUpShare: 0.15,
      seepTest: { setting: 'air', hours: 24 },
    },
    sources: { olla: { usual: 'mains' }, surface: { usual: 'mains' } },
    potRecipe: {
      shape: 'twin_pot',
      make: 'joined_terracotta',
      clayBody: 'terracotta',
      firingCone: '04',
      capacityL: [6, 7],
      notes: 'Two terracotta pots joined rim to rim (the pots were stamped cone 04).',
    },
    trials: [
      {
        key: 'maren-pepper',
        title: 'Chiles along the fence',
        crop: 'sweet-pepper',
        variety: 'Long green chile',
        question: 'Twin pots in silty clay: same chiles with less water?',
        plantingDate: '2026-05-18',
        endDate: '2026-09-24',
        lastLogDate: '2026-09-24',
        status: 'closed',
        pairAreasM2: [1.5, 1.5, 2, 2],
        setting: 'in_ground',
        mulch: false,
        lid: true,
        potsPerOllaPlot: 2,
        sharedOn: '2026-05-25',
        harvestLogged: true,
        ollaYieldEffect: 1.03,
      },
    ],
    spares: [
      {
        label: 'V-spare',
        recipe: { shape: 'twin_pot', make: 'joined_terracotta', clayBody: 'terracotta', firingCone: '04', capacityL: [6, 6], notes: '' },
        capacityL: 6,
        condition: 'sound',
        notes: 'Spare twin pot.',
      },
    ],
    observations: [
      { day: { firstRainFrom: '2026-08-01' }, hour: 18, text: 'Ten minutes of hail with the storm. Leaves shredded on both sides of every pair.' },
    ],
  },
];
