import type { EntityManager } from 'typeorm';
import { insertRows, type ColumnType } from './bulk-insert';

/**
 * The columns the demo season fills in each table, with their PostgreSQL types, in insert
 * order (parents before children). Read from server/db/migrations.
 */
export const SEASON_TABLES = {
  gardens: {
    id: 'uuid',
    owner_id: 'uuid',
    name: 'text',
    latitude_deg: 'float8',
    longitude_deg: 'float8',
    elevation_m: 'float8',
    soil_texture: 'text',
    coastal: 'bool',
    notes: 'text',
    time_zone: 'text',
    created_at: 'timestamptz',
    updated_at: 'timestamptz',
  },
  trials: {
    id: 'uuid',
    garden_id: 'uuid',
    owner_id: 'uuid',
    title: 'text',
    crop: 'text',
    crop_name: 'text',
    variety: 'text',
    planting_date: 'date',
    end_date: 'date',
    design: 'text',
    treatments: 'jsonb',
    question: 'text',
    protocol_notes: 'text',
    kc_overrides: 'jsonb',
    stress_thresholds: 'jsonb',
    status: 'text',
    randomisation_seed: 'text',
    created_at: 'timestamptz',
    updated_at: 'timestamptz',
  },
  plots: {
    id: 'uuid',
    trial_id: 'uuid',
    label: 'text',
    treatment: 'text',
    block_key: 'text',
    area_m2: 'float8',
    setting: 'text',
    mulch: 'bool',
    lid: 'bool',
    plant_count: 'int4',
    created_at: 'timestamptz',
  },
  pots: {
    id: 'uuid',
    owner_id: 'uuid',
    label: 'text',
    capacity_l: 'float8',
    height_cm: 'float8',
    widest_diameter_cm: 'float8',
    neck_diameter_cm: 'float8',
    shape: 'text',
    clay_body: 'text',
    make: 'text',
    firing_cone: 'text',
    installed_on: 'date',
    plot_id: 'uuid',
    condition: 'text',
    notes: 'text',
    created_at: 'timestamptz',
    updated_at: 'timestamptz',
  },
  seep_tests: {
    id: 'uuid',
    pot_id: 'uuid',
    tested_on: 'date',
    setting: 'text',
    litres_lost: 'float8',
    hours: 'float8',
    notes: 'text',
    created_at: 'timestamptz',
  },
  weather_days: {
    id: 'uuid',
    garden_id: 'uuid',
    day: 'date',
    forecast: 'bool',
    t_min_c: 'float8',
    t_max_c: 'float8',
    rain_mm: 'float8',
    rh_min_pct: 'float8',
    rh_max_pct: 'float8',
    wind_speed_ms: 'float8',
    wind_height_m: 'float8',
    sunshine_hours: 'float8',
    entered_by: 'uuid',
    created_at: 'timestamptz',
  },
  water_events: {
    id: 'uuid',
    trial_id: 'uuid',
    plot_id: 'uuid',
    entered_by: 'uuid',
    created_at: 'timestamptz',
    occurred_at: 'timestamptz',
    kind: 'text',
    volume_l: 'float8',
    source: 'text',
    fertiliser: 'bool',
    pot_id: 'uuid',
    notes: 'text',
  },
  moisture_readings: {
    id: 'uuid',
    trial_id: 'uuid',
    plot_id: 'uuid',
    entered_by: 'uuid',
    created_at: 'timestamptz',
    taken_at: 'timestamptz',
    method: 'text',
    depth_cm: 'float8',
    value: 'float8',
  },
  harvests: {
    id: 'uuid',
    trial_id: 'uuid',
    plot_id: 'uuid',
    entered_by: 'uuid',
    created_at: 'timestamptz',
    harvested_on: 'date',
    fresh_kg: 'float8',
    count: 'int4',
    marketable_kg: 'float8',
    notes: 'text',
  },
  observations: { id: 'uuid', trial_id: 'uuid', plot_id: 'uuid', observed_at: 'timestamptz', text: 'text', entered_by: 'uuid', created_at: 'timestamptz' },
  trial_shares: { id: 'uuid', trial_id: 'uuid', cohort_id: 'uuid', shared_at: 'timestamptz' },
  audit_entries: {
    id: 'uuid',
    trial_id: 'uuid',
    actor_id: 'uuid',
    at: 'timestamptz',
    action: 'text',
    entity_type: 'text',
    entity_id: 'uuid',
    changes: 'jsonb',
  },
} as const satisfies Record<string, Record<string, ColumnType>>;

export type SeasonTable = keyof typeof SEASON_TABLES;
export type SeasonRow<T extends SeasonTable> = Record<keyof (typeof SEASON_TABLES)[T], unknown>;
export type SeasonRows = { [T in SeasonTable]: SeasonRow<T>[] };

export function emptySeasonRows(): SeasonRows {
  return Object.fromEntries(Object.keys(SEASON_TABLES).map((t) => [t, []])) as unknown as SeasonRows;
}

/** Inserts every table's rows, one statement per table, parents first. Returns the row counts. */
export async function insertSeason(tx: EntityManager, rows: SeasonRows): Promise<Record<SeasonTable, number>> {
  const counts = {} as Record<SeasonTable, number>;
  for (const table of Object.keys(SEASON_TABLES) as SeasonTable[]) {
    const columns: Record<string, ColumnType> = SEASON_TABLES[table];
    await insertRows(tx, table, columns, rows[table] as Record<string, unknown>[]);
    counts[table] = rows[table].length;
  }
  return counts;
}
