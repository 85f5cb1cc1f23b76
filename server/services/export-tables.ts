/**
 * The exported tables, defined once: the SQL that streams them and the data dictionary that
 * describes them come from the same column list. Tidy long format (one observation per row),
 * ISO 8601 dates, SI units in the column names.
 */

export type ExportScope = { kind: 'trial'; trialId: string } | { kind: 'cohort'; cohortId: string };

export interface ExportColumn {
  name: string;
  type: 'text' | 'number' | 'integer' | 'boolean' | 'date' | 'datetime';
  unit: string;
  description: string;
  /** SQL expression; text columns are neutralised against spreadsheet formulas. */
  sql: string;
}

export interface ExportTable {
  name: string;
  description: string;
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

/** Who the row belongs to: the trial id for its owner, stable pseudonymous codes in cohort exports. */
function idColumns(scope: ExportScope): ExportColumn[] {
  if (scope.kind === 'trial') {
    return [{ name: 'trial_id', type: 'text', unit: '', description: 'Identifier of the trial.', sql: 't.id::text' }];
  }
  return [
    {
      name: 'trial_code',
      type: 'text',
      unit: '',
      description: 'Pseudonymous code of the trial, stable within this cohort (not the database id).',
      sql: `'T' || upper(substr(md5(s.cohort_id::text || t.id::text), 1, 8))`,
    },
    { name: 'member', type: 'text', unit: '', description: "The contributing member's pseudonym in this cohort (never the real name).", sql: safeText('m.pseudonym') },
  ];
}

const plotCols: ExportColumn[] = [
  { name: 'plot', type: 'text', unit: '', description: 'Plot label, unique within the trial.', sql: safeText('p.label') },
  { name: 'pair', type: 'text', unit: '', description: 'Pair (paired design) or block the plot belongs to.', sql: safeText('p.block_key') },
  { name: 'treatment', type: 'text', unit: '', description: 'olla (buried clay pots), surface (surface watering) or another named treatment.', sql: safeText("coalesce(p.treatment, '')") },
];

export const exportTables: ExportTable[] = [
  {
    name: 'plots',
    description: 'One row per plot.',
    from: 'plots p JOIN trials t ON t.id = p.trial_id',
    orderBy: 't.id, p.block_key, p.label',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'area_m2', type: 'number', unit: 'm²', description: 'Plot area.', sql: 'p.area_m2' },
      { name: 'setting', type: 'text', unit: '', description: 'in_ground, raised_bed or container.', sql: 'p.setting' },
      { name: 'mulch', type: 'boolean', unit: '', description: 'Whether the plot was mulched.', sql: 'p.mulch' },
      { name: 'lid', type: 'boolean', unit: '', description: 'Whether the pots had lids.', sql: 'p.lid' },
      { name: 'plant_count', type: 'integer', unit: 'plants', description: 'Number of plants in the plot.', sql: 'p.plant_count' },
      { name: 'crop', type: 'text', unit: '', description: 'Crop of the trial (FAO-56 crop name where known).', sql: `CASE WHEN t.crop = 'other' THEN ${safeText('t.crop_name')} ELSE t.crop END` },
      { name: 'planting_date', type: 'date', unit: '', description: 'Planting date of the trial (ISO 8601).', sql: "to_char(t.planting_date, 'YYYY-MM-DD')" },
      { name: 'pot_count', type: 'integer', unit: 'pots', description: 'Pots placed in the plot.', sql: '(SELECT count(*) FROM pots o WHERE o.plot_id = p.id)' },
      { name: 'pot_capacity_l', type: 'number', unit: 'L', description: 'Total capacity of the pots in the plot.', sql: '(SELECT coalesce(sum(o.capacity_l), 0) FROM pots o WHERE o.plot_id = p.id)' },
    ],
  },
  {
    name: 'water-events',
    description: 'One row per olla refill or surface watering.',
    from: 'water_events x JOIN plots p ON p.id = x.plot_id JOIN trials t ON t.id = x.trial_id',
    orderBy: 'x.occurred_at, p.label, x.id',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'occurred_at', type: 'datetime', unit: 'UTC', description: 'When the water was given (ISO 8601, UTC).', sql: iso('x.occurred_at') },
      { name: 'kind', type: 'text', unit: '', description: 'olla_refill or surface.', sql: 'x.kind' },
      { name: 'volume_l', type: 'number', unit: 'L', description: 'Volume of water given.', sql: 'x.volume_l' },
      { name: 'source', type: 'text', unit: '', description: 'mains, rainwater, greywater, well or other.', sql: 'x.source' },
      { name: 'fertiliser', type: 'boolean', unit: '', description: 'Fertiliser or compost tea added.', sql: 'x.fertiliser' },
      ...(scope.kind === 'trial' ? [{ name: 'notes', type: 'text' as const, unit: '', description: 'Free-text note (trial exports only).', sql: safeText('x.notes') }] : []),
    ],
  },
  {
    name: 'moisture-readings',
    description: 'One row per soil moisture reading; each method on its own scale, never mixed.',
    from: 'moisture_readings x JOIN plots p ON p.id = x.plot_id JOIN trials t ON t.id = x.trial_id',
    orderBy: 'x.taken_at, p.label, x.id',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'taken_at', type: 'datetime', unit: 'UTC', description: 'When the reading was taken (ISO 8601, UTC).', sql: iso('x.taken_at') },
      { name: 'method', type: 'text', unit: '', description: 'vwc (volumetric water content), tensiometer or probe_index.', sql: 'x.method' },
      { name: 'depth_cm', type: 'number', unit: 'cm', description: 'Depth of the reading.', sql: 'x.depth_cm' },
      { name: 'value', type: 'number', unit: 'see unit column', description: 'The reading, on the scale of its method.', sql: 'x.value' },
      {
        name: 'unit',
        type: 'text',
        unit: '',
        description: '% for vwc, kPa for tensiometer, index (1–10) for probe_index.',
        sql: "CASE x.method WHEN 'vwc' THEN '%' WHEN 'tensiometer' THEN 'kPa' ELSE 'index' END",
      },
    ],
  },
  {
    name: 'harvests',
    description: 'One row per pick.',
    from: 'harvests x JOIN plots p ON p.id = x.plot_id JOIN trials t ON t.id = x.trial_id',
    orderBy: 'x.harvested_on, p.label, x.id',
    columns: (scope) => [
      ...idColumns(scope),
      ...plotCols,
      { name: 'harvested_on', type: 'date', unit: '', description: 'Day of the pick (ISO 8601).', sql: "to_char(x.harvested_on, 'YYYY-MM-DD')" },
      { name: 'fresh_kg', type: 'number', unit: 'kg', description: 'Fresh mass picked.', sql: 'x.fresh_kg' },
      { name: 'marketable_kg', type: 'number', unit: 'kg', description: 'Marketable part of the fresh mass (empty when not recorded).', sql: 'x.marketable_kg' },
      { name: 'count', type: 'integer', unit: 'fruits', description: 'Number of fruits (empty when not counted).', sql: 'x.count' },
      ...(scope.kind === 'trial' ? [{ name: 'notes', type: 'text' as const, unit: '', description: 'Free-text note (trial exports only).', sql: safeText('x.notes') }] : []),
    ],
  },
  {
    name: 'weather-days',
    description: "One row per day of the garden's weather during the trial.",
    from: "weather_days x JOIN trials t ON t.garden_id = x.garden_id AND x.day >= t.planting_date AND x.day <= coalesce(t.end_date, 'infinity'::date)",
    orderBy: 't.id, x.day, x.forecast',
    columns: (scope) => [
      ...idColumns(scope),
      { name: 'day', type: 'date', unit: '', description: 'Calendar day (ISO 8601).', sql: "to_char(x.day, 'YYYY-MM-DD')" },
      { name: 'forecast', type: 'boolean', unit: '', description: 'A forecast rather than an observation.', sql: 'x.forecast' },
      { name: 't_min_c', type: 'number', unit: '°C', description: 'Minimum air temperature.', sql: 'x.t_min_c' },
      { name: 't_max_c', type: 'number', unit: '°C', description: 'Maximum air temperature.', sql: 'x.t_max_c' },
      { name: 'rain_mm', type: 'number', unit: 'mm', description: 'Rain.', sql: 'x.rain_mm' },
      { name: 'rh_min_pct', type: 'number', unit: '%', description: 'Minimum relative humidity.', sql: 'x.rh_min_pct' },
      { name: 'rh_max_pct', type: 'number', unit: '%', description: 'Maximum relative humidity.', sql: 'x.rh_max_pct' },
      { name: 'wind_speed_ms', type: 'number', unit: 'm/s', description: 'Mean wind speed at the measuring height.', sql: 'x.wind_speed_ms' },
      { name: 'wind_height_m', type: 'number', unit: 'm', description: 'Height of the wind measurement.', sql: 'x.wind_height_m' },
      { name: 'sunshine_hours', type: 'number', unit: 'h', description: 'Hours of bright sunshine.', sql: 'x.sunshine_hours' },
      { name: 'solar_radiation_mj', type: 'number', unit: 'MJ/m²/day', description: 'Solar radiation.', sql: 'x.solar_radiation_mj' },
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

/** The data dictionary rows for a scope: file, column, type, unit, description. */
export function dictionaryRows(scope: ExportScope): string[][] {
  const rows: string[][] = [['file', 'column', 'type', 'unit', 'description']];
  for (const t of exportTables) {
    rows.push([`${t.name}.csv`, '', '', '', t.description]);
    for (const c of t.columns(scope)) rows.push([`${t.name}.csv`, c.name, c.type, c.unit, c.description]);
  }
  return rows;
}
