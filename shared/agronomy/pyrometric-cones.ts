/**
 * Pyrometric cones: what a pot's firing says about its porosity. An olla works because its
 * low-fired earthenware wall stays porous; firing hotter vitrifies the clay and seepage
 * slows or stops.
 *
 * Cones measure heat-work (time and temperature together), so a cone's equivalent
 * temperature depends on the heating rate in the last part of the firing. Two charts are
 * kept, each named with its heating rate:
 *
 * 1. 'orton-standard-150': the Orton "standard temperature equivalent chart, when heated at
 *    150 °C/hour", the chart most often reproduced in potters' references. °C values read in
 *    two independent transcriptions that agree on every row; °F values in one of them
 *    (V(t)). It is the source of the familiar cone 04 = 1060 °C = 1940 °F,
 *    cone 05 = 1046 °C, cone 06 = 999 °C. It is the default chart.
 * 2. 'orton-self-supporting-60': the current Orton chart for self-supporting regular cones
 *    at 60 °C/hour (108 °F/hour) in the last 100 °C (large cones for 022-020, which are not
 *    made self-supporting). °F read in one transcription of the chart (V(t)); °C for cones
 *    022-08 read in a transcription of the Orton °C chart (V(t)); °C for cones 07-10 from
 *    memory (M), each within 0.5 °C of the printed °F.
 *    Note: at 60 °C/h this chart gives cone 04 = 1063 °C / 1945 °F, not 1060 / 1940.
 *
 * Half cones (05½, 03½, 5½) are left out.
 */
import { AnalysisInputError } from '../analysis/input-error';

export const CONE_IDS = [
  '022',
  '021',
  '020',
  '019',
  '018',
  '017',
  '016',
  '015',
  '014',
  '013',
  '012',
  '011',
  '010',
  '09',
  '08',
  '07',
  '06',
  '05',
  '04',
  '03',
  '02',
  '01',
  '1',
  '2',
  '3',
  '4',
  '5',
  '6',
  '7',
  '8',
  '9',
  '10',
] as const;
export type ConeId = (typeof CONE_IDS)[number];

export type ConeChartId = 'orton-standard-150' | 'orton-self-supporting-60';

/** 'V(t)': read in a transcription of the chart; 'M': from memory, unverified. */
export type SourceConfidence = 'V(t)' | 'M';

export interface ConeChartRow {
  celsius: number;
  fahrenheit: number;
  confidence: SourceConfidence;
}

export interface ConeChart {
  id: ConeChartId;
  name: string;
  heatingRateCPerHour: number;
  rows: Readonly<Record<ConeId, ConeChartRow>>;
}

function rows(values: ReadonlyArray<readonly [ConeId, number, number, SourceConfidence]>): Record<ConeId, ConeChartRow> {
  const out = {} as Record<ConeId, ConeChartRow>;
  for (const [cone, celsius, fahrenheit, confidence] of values) out[cone] = { celsius, fahrenheit, confidence };
  return out;
}

export const CONE_CHARTS: Readonly<Record<ConeChartId, ConeChart>> = {
  'orton-standard-150': {
    id: 'orton-standard-150',
    name: 'Orton standard temperature equivalent chart (heated at 150 °C/h)',
    heatingRateCPerHour: 150,
    rows: rows([
      ['022', 600, 1112, 'V(t)'],
      ['021', 614, 1137, 'V(t)'],
      ['020', 635, 1175, 'V(t)'],
      ['019', 683, 1261, 'V(t)'],
      ['018', 717, 1322, 'V(t)'],
      ['017', 747, 1376, 'V(t)'],
      ['016', 792, 1457, 'V(t)'],
      ['015', 804, 1479, 'V(t)'],
      ['014', 838, 1540, 'V(t)'],
      ['013', 852, 1565, 'V(t)'],
      ['012', 884, 1623, 'V(t)'],
      ['011', 894, 1641, 'V(t)'],
      ['010', 900, 1652, 'V(t)'],
      ['09', 923, 1693, 'V(t)'],
      ['08', 955, 1751, 'V(t)'],
      ['07', 984, 1803, 'V(t)'],
      ['06', 999, 1830, 'V(t)'],
      ['05', 1046, 1914, 'V(t)'],
      ['04', 1060, 1940, 'V(t)'],
      ['03', 1101, 2014, 'V(t)'],
      ['02', 1120, 2048, 'V(t)'],
      ['01', 1137, 2079, 'V(t)'],
      ['1', 1154, 2109, 'V(t)'],
      ['2', 1162, 2124, 'V(t)'],
      ['3', 1168, 2134, 'V(t)'],
      ['4', 1186, 2167, 'V(t)'],
      ['5', 1196, 2185, 'V(t)'],
      ['6', 1222, 2232, 'V(t)'],
      ['7', 1240, 2264, 'V(t)'],
      ['8', 1263, 2305, 'V(t)'],
      ['9', 1280, 2336, 'V(t)'],
      ['10', 1305, 2381, 'V(t)'],
    ]),
  },
  'orton-self-supporting-60': {
    id: 'orton-self-supporting-60',
    name: 'Orton self-supporting cones, regular (heated at 60 °C/h in the last 100 °C)',
    heatingRateCPerHour: 60,
    rows: rows([
      ['022', 586, 1087, 'V(t)'],
      ['021', 600, 1112, 'V(t)'],
      ['020', 626, 1159, 'V(t)'],
      ['019', 678, 1252, 'V(t)'],
      ['018', 715, 1319, 'V(t)'],
      ['017', 738, 1360, 'V(t)'],
      ['016', 772, 1422, 'V(t)'],
      ['015', 791, 1456, 'V(t)'],
      ['014', 807, 1485, 'V(t)'],
      ['013', 837, 1539, 'V(t)'],
      ['012', 861, 1582, 'V(t)'],
      ['011', 875, 1607, 'V(t)'],
      ['010', 903, 1657, 'V(t)'],
      ['09', 920, 1688, 'V(t)'],
      ['08', 942, 1728, 'V(t)'],
      ['07', 976, 1789, 'M'],
      ['06', 998, 1828, 'M'],
      ['05', 1031, 1888, 'M'],
      ['04', 1063, 1945, 'M'],
      ['03', 1086, 1987, 'M'],
      ['02', 1102, 2016, 'M'],
      ['01', 1119, 2046, 'M'],
      ['1', 1137, 2079, 'M'],
      ['2', 1142, 2088, 'M'],
      ['3', 1152, 2106, 'M'],
      ['4', 1162, 2124, 'M'],
      ['5', 1186, 2167, 'M'],
      ['6', 1222, 2232, 'M'],
      ['7', 1239, 2262, 'M'],
      ['8', 1249, 2280, 'M'],
      ['9', 1260, 2300, 'M'],
      ['10', 1285, 2345, 'M'],
    ]),
  },
};

export const DEFAULT_CONE_CHART: ConeChartId = 'orton-standard-150';

export function isConeId(value: string): value is ConeId {
  return (CONE_IDS as readonly string[]).includes(value);
}

export interface ConeTemperature {
  cone: ConeId;
  celsius: number;
  fahrenheit: number;
  chart: string;
  heatingRateCPerHour: number;
  confidence: SourceConfidence;
}

/** Equivalent temperature of a cone in the chosen chart (default: Orton standard, 150 °C/h). */
export function coneTemperature(cone: string, chartId: ConeChartId = DEFAULT_CONE_CHART): ConeTemperature {
  if (!isConeId(cone)) {
    throw new AnalysisInputError(`Unknown cone "${cone}". Use 022 to 01 (low) or 1 to 10; 06 and 6 are different cones.`);
  }
  const chart = CONE_CHARTS[chartId];
  if (!chart) throw new AnalysisInputError(`Unknown cone chart "${String(chartId)}".`);
  const row = chart.rows[cone];
  return {
    cone,
    celsius: row.celsius,
    fahrenheit: row.fahrenheit,
    chart: chart.name,
    heatingRateCPerHour: chart.heatingRateCPerHour,
    confidence: row.confidence,
  };
}

export type FiringBand = 'underfired' | 'porous-earthenware' | 'vitrifying';

/**
 * What a firing cone means for an olla. Bands (common practice, no source; clay bodies
 * differ): below cone 010 the body is weakly sintered and may not last in wet soil;
 * cones 010 to 02 cover porous low-fire earthenware, with cone 04 (about 1060 °C) the
 * typical olla firing; from cone 01 up the clay increasingly vitrifies and stops seeping.
 */
export function firingBand(cone: string): FiringBand {
  if (!isConeId(cone)) coneTemperature(cone);
  const index = CONE_IDS.indexOf(cone as ConeId);
  if (index < CONE_IDS.indexOf('010')) return 'underfired';
  if (index <= CONE_IDS.indexOf('02')) return 'porous-earthenware';
  return 'vitrifying';
}

/** A short, plain-language note on the firing of a pot for use as an olla. */
export function firingNote(cone: string): string {
  const { celsius } = coneTemperature(cone);
  const reference = coneTemperature('04');
  const around = `Cone ${cone} is about ${celsius} °C (Orton chart at 150 °C/h).`;
  const earthenware = `Porous low-fire earthenware sits around cone 04 (~${reference.celsius} °C).`;
  switch (firingBand(cone)) {
    case 'underfired':
      return `${around} That is below the usual earthenware range: the clay is barely sintered and may soften or crumble in wet soil. ${earthenware}`;
    case 'porous-earthenware':
      return `${around} Low-fire earthenware stays porous, so water seeps through the wall as an olla needs. ${earthenware}`;
    case 'vitrifying':
      return `${around} Firing this hot vitrifies the clay: the pores close and seepage slows or stops, so the pot suits storage better than irrigation. ${earthenware}`;
  }
}
