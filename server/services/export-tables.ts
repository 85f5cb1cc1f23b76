/**
 * The exported tables, defined once: the SQL that streams them and the data dictionary that
 * describes them come from the same column list. Tidy long format (one observation per row),
 * ISO 8601 dates, SI units in the column names.
 */

import type enExport from '@shared/locales/en/export.json';
import { enT, type Translate } from '@shared/i18n/translate';

export type ExportScope = { kind: 'trial'; trialId: string } | { kind: 'cohort'; cohortId: string };

/** Stable column names: the same in every language (their labels and descriptions are in shared/locales/<lang>/export.json). */
export type ExportColumnName = keyof typeof enExport.columns;
export type ExportTableName = Exclude<keyof typeof enExport.tables, 'trials'>;

export interface ExportColumn {
  name: ExportColumnName;
  type: 'text' | 'number' | 'integer' | 'boolean' | 'date' | 'datetime';
  /** Unit symbol, or a word translated in the dictionary ('plants', 'pots', 'fruits', 'seeUnitColumn'). */
  unit: string;
  /** SQL expression; text columns are neutralised against spreadsheet formulas. */
  sql: string;
}

export interface ExportTable {
  /** File name without .csv; its description is `export.tables.<name>` in shared/locales. */
  name: ExportTableName;
  columns: (scope: ExportScope) => ExportColumn[];
  /** FROM ... JOIN ... with `t` = trials; WHERE is added for the scope. */
  from: string;
  orderBy: string;
}

/** Spreadsheets run a cell that starts with = + - @ tab or CR as a formula: prefix it with a quote. */
export function safeText(expr: string): string {
  return `CASE WHEN left(${expr}, 1) IN ('=', '+', '-', '@', chr(9), chr(13)) THEN '''' || ${expr} ELSE ${expr} END`;
}

const iso = (expr: string) => `to_char(${expr} AT TIME ZONE 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS"Z"')`;
/** The calendar day of an instant in the garden's time zone (`g` = gardens), the day the analysis counts it on. */
const gardenDay = (expr: string) => `to_char(${expr} AT TIME ZONE g.time_zone, 'YYYY-MM-DD')`;

/** Who the row belongs to: the trial id for its owner, stable pseudonymous codes in cohort exports. */
function idColumns(scope: ExportScope): ExportColumn[] {
  if (scope.kind === 'trial') {
    return [{ name: 'trial_id', type: 'text', unit: '', sql: 't.id::text' }];
  }
  return [
    {
      name: 'trial_code',
      type: 'text',
      unit: '',
     
      sql: `'T' || upper(substr(md5(s.cohort_id::text || t.id::text), 1, 8))`,
    },
    { name: 'member', type: 'text', unit: '', sql: safeText('m.pseudonym') },
  ];
}

const plotCols: ExportColumn[] = [
  { name: 'plot', type: 'text', unit: '', sql: safeText('p.label') },
  { name: 'pair', type: 'text', unit: '', sql: safeText('p.block_key') },
  { name: 'treatment', type: 'text', unit: '', sql: safeText("coalesce(p.treatment, '')") },
];

export const exportTables: ExportTable[] = [
  {
    name: 'plots',
   
    from: 'plots p JOIN trials t ON t.id = p.trial_id',
    orderBy: 't.id, p.block_key, p.label',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'area_m2', type: 'number', unit: 'm²', sql: 'p.area_m2' },
      { name: 'setting', type: 'text', unit: '', sql: 'p.setting' },
      { name: 'mulch', type: 'boolean', unit: '', sql: 'p.mulch' },
      { name: 'lid', type: 'boolean', unit: '', sql: 'p.lid' },
      { name: 'plant_count', type: 'integer', unit: 'plants', sql: 'p.plant_count' },
      { name: 'crop', type: 'text', unit: '', sql: `CASE WHEN t.crop = 'other' THEN ${safeText('t.crop_name')} ELSE t.crop END` },
      { name: 'planting_date', type: 'date', unit: '', sql: "to_char(t.planting_date, 'YYYY-MM-DD')" },
      { name: 'pot_count', type: 'integer', unit: 'pots', sql: '(SELECT count(*) FROM pots o WHERE o.plot_id = p.id)' },
      { name: 'pot_capacity_l', type: 'number', unit: 'L', sql: '(SELECT coalesce(sum(o.capacity_l), 0) FROM pots o WHERE o.plot_id = p.id)' },
    ],
  },
  {
    name: 'water-events',
   
    from: 'water_events x JOIN plots p ON p.id = x.plot_id JOIN trials t ON t.id = x.trial_id JOIN gardens g ON g.id = t.garden_id',
    orderBy: 'x.occurred_at, p.label, x.id',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'occurred_at', type: 'datetime', unit: 'UTC', sql: iso('x.occurred_at') },
      { name: 'day', type: 'date', unit: '', sql: gardenDay('x.occurred_at') },
      { name: 'kind', type: 'text', unit: '', sql: 'x.kind' },
      { name: 'volume_l', type: 'number', unit: 'L', sql: 'x.volume_l' },
      { name: 'source', type: 'text', unit: '', sql: 'x.source' },
      { name: 'fertiliser', type: 'boolean', unit: '', sql: 'x.fertiliser' },
      ...(scope.kind === 'trial' ? [{ name: 'notes' as const, type: 'text' as const, unit: '', sql: safeText('x.notes') }] : []),
    ],
  },
  {
    name: 'moisture-readings',
   
    from: 'moisture_readings x JOIN plots p ON p.id = x.plot_id JOIN trials t ON t.id = x.trial_id JOIN gardens g ON g.id = t.garden_id',
    orderBy: 'x.taken_at, p.label, x.id',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'taken_at', type: 'datetime', unit: 'UTC', sql: iso('x.taken_at') },
      { name: 'day', type: 'date', unit: '', sql: gardenDay('x.taken_at') },
      { name: 'method', type: 'text', unit: '', sql: 'x.method' },
      { name: 'depth_cm', type: 'number', unit: 'cm', sql: 'x.depth_cm' },
      { name: 'value', type: 'number', unit: 'seeUnitColumn', sql: 'x.value' },
      {
        name: 'unit',
        type: 'text',
        unit: '',
       
        sql: "CASE x.method WHEN 'vwc' THEN '%' WHEN 'tensiometer' THEN 'kPa' ELSE 'index' END",
      },
    ],
  },
  {
    name: 'harvests',
   
    from: 'harvests x JOIN plots p ON p.id = x.plot_id JOIN trials t ON t.id = x.trial_id',
    orderBy: 'x.harvested_on, p.label, x.id',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'harvested_on', type: 'date', unit: '', sql: "to_char(x.harvested_on, 'YYYY-MM-DD')" },
      { name: 'fresh_kg', type: 'number', unit: 'kg', sql: 'x.fresh_kg' },
      { name: 'marketable_kg', type: 'number', unit: 'kg', sql: 'x.marketable_kg' },
      { name: 'count', type: 'integer', unit: 'fruits', sql: 'x.count' },
      ...(scope.kind === 'trial' ? [{ name: 'notes' as const, type: 'text' as const, unit: '', sql: safeText('x.notes') }] : []),
    ],
  },
  {
    name: 'weather-days',
   
    from: "weather_days x JOIN trials t ON t.garden_id = x.garden_id AND x.day >= t.planting_date AND x.day <= coalesce(t.end_date, 'infinity'::date)",
    orderBy: 't.id, x.day, x.forecast',
    columns: (scope) => [
      ...idColumns(scope),
      { name: 'day', type: 'date', unit: '', sql: "to_char(x.day, 'YYYY-MM-DD')" },
      { name: 'forecast', type: 'boolean', unit: '', sql: 'x.forecast' },
      { name: 't_min_c', type: 'number', unit: '°C', sql: 'x.t_min_c' },
      { name: 't_max_c', type: 'number', unit: '°C', sql: 'x.t_max_c' },
      { name: 'rain_mm', type: 'number', unit: 'mm', sql: 'x.rain_mm' },
      { name: 'rh_min_pct', type: 'number', unit: '%', sql: 'x.rh_min_pct' },
      { name: 'rh_max_pct', type: 'number', unit: '%', sql: 'x.rh_max_pct' },
      { name: 'wind_speed_ms', type: 'number', unit: 'm/s', sql: 'x.wind_speed_ms' },
      { name: 'wind_height_m', type: 'number', unit: 'm', sql: 'x.wind_height_m' },
      { name: 'sunshine_hours', type: 'number', unit: 'h', sql: 'x.sunshine_hours' },
      { name: 'solar_radiation_mj', type: 'number', unit: 'MJ/m²/day', sql: 'x.solar_radiation_mj' },
    ],
  },
];

export function findExportTable(name: string): ExportTable | undefined {
  return exportTables.find((t) => t.name === name);
}

/** The SELECT for one table and scope. Ids are inlined as escaped literals because COPY takes no parameters. */
export function exportSelect(table: ExportTable, scope: ExportScope, literal: (v: string) => string): string {
  const cols = table.columns(scope);
  // COPY writes booleans as t/f; spell them out for spreadsheets and readers.
  const expr = (c: ExportColumn) => (c.type === 'boolean' ? `CASE WHEN ${c.sql} THEN 'true' ELSE 'false' END` : c.sql);
  const select = cols.map((c) => `${expr(c)} AS "${c.name}"`).join(', ');
  if (scope.kind === 'trial') {
    return `SELECT ${select} FROM ${table.from} WHERE t.id = ${literal(scope.trialId)} ORDER BY ${table.orderBy}`;
  }
  const cohort = literal(scope.cohortId);
  return `SELECT ${select} FROM ${table.from}
            JOIN trial_shares s ON s.trial_id = t.id AND s.cohort_id = ${cohort} AND s.withdrawn_at IS NULL
            JOIN cohort_memberships m ON m.cohort_id = s.cohort_id AND m.user_id = t.owner_id
           ORDER BY ${table.orderBy}`;
}

/** The extra table of a cohort report bundle (data/trials.csv), built in JS from the cohort results. */
export const cohortTrialsColumns: { name: ExportColumnName; type: ExportColumn['type']; unit: string }[] = [
  { name: 'member', type: 'text', unit: '' },
  { name: 'crop', type: 'text', unit: '' },
  { name: 'region', type: 'text', unit: '' },
  { name: 'soil_texture', type: 'text', unit: '' },
  { name: 'pairs', type: 'integer', unit: '' },
  { name: 'completeness_pct', type: 'integer', unit: '%' },
  { name: 'water_log_ratio', type: 'number', unit: '' },
  { name: 'water_log_ratio_variance', type: 'number', unit: '' },
  { name: 'flags', type: 'text', unit: '' },
  { name: 'excluded', type: 'boolean', unit: '' },
];

const unitWords = new Set(['plants', 'pots', 'fruits', 'seeUnitColumn']);

/**
 * The data dictionary in the reader's language: file, column, type, unit, label, description.
 *
 * Column names (and this file's own header) are stable English identifiers in every language, so
 * a script written against one export reads every other; the `label` column gives a readable name
 * and `description` the meaning, both translated. The first row says so, and that numbers keep dot
 * decimals whatever the language (DEVELOPERS.md, "Exports in two languages").
 */
export function dictionaryRows(scope: ExportScope, t: Translate = enT, options: { withTrialsTable?: boolean } = {}): string[][] {
  const rows: string[][] = [['file', 'column', 'type', 'unit', 'label', 'description']];
  rows.push(['', '', '', '', '', t('export.about')]);
  const unit = (u: string) => (unitWords.has(u) ? t(`export.units.${u as 'plants'}`) : u);
  const column = (file: string, c: { name: ExportColumnName; type: string; unit: string }) => [file, c.name, c.type, unit(c.unit), t(`export.columns.${c.name}.label`), t(`export.columns.${c.name}.description`)];
  for (const table of exportTables) {
    const file = `${table.name}.csv`;
    rows.push([file, '', '', '', '', t(`export.tables.${table.name}`)]);
    for (const c of table.columns(scope)) rows.push(column(file, c));
  }
  if (options.withTrialsTable) {
    rows.push(['trials.csv', '', '', '', '', t('export.tables.trials')]);
    for (const c of cohortTrialsColumns) rows.push(column('trials.csv', c));
  }
  return rows;
}
