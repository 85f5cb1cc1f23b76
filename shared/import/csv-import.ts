/**
 * Turning a spreadsheet or logger CSV into Seepwise records: guessing which column is which,
 * detecting date formats (and refusing to guess when 03/04/2027 could be two days), converting
 * units to SI, and listing every row-level problem with its line and column. Pure: runs in the
 * browser's parsing worker, and its output is validated again on the server.
 */
import { fromDisplay, type Quantity } from '../units';
import { instantOfWallClock, type WallClock } from '../time-zone';

export const importKinds = ['water-events', 'moisture-readings', 'harvests', 'weather-days'] as const;
export type ImportKind = (typeof importKinds)[number];

export type FieldType = 'text' | 'number' | 'integer' | 'boolean' | 'date' | 'datetime';

export interface ImportField {
  /** The record field the column fills (plotLabel stands for the plot). */
  key: string;
  label: string;
  type: FieldType;
  required: boolean;
  /** Header names (lower case, without spaces or punctuation) that map to this field. */
  aliases: string[];
  /** Quantity with a unit choice; values are converted to SI. */
  quantity?: Quantity;
  /** Extra unit options beyond metric/us for this field. */
  units?: string[];
}

export const importFields: Record<ImportKind, ImportField[]> = {
  'water-events': [
    { key: 'plotLabel', label: 'Plot', type: 'text', required: true, aliases: ['plot', 'plotlabel', 'bed', 'parcela'] },
    { key: 'occurredAt', label: 'Date and time', type: 'datetime', required: true, aliases: ['occurredat', 'date', 'datetime', 'time', 'when', 'fecha', 'timestamp', 'fechayhora', 'hora'] },
    { key: 'kind', label: 'Kind (olla_refill or surface)', type: 'text', required: true, aliases: ['kind', 'type', 'method', 'tipo', 'riego', 'tipoderiego'] },
    { key: 'volumeL', label: 'Volume', type: 'number', required: true, quantity: 'volume', aliases: ['volumel', 'volume', 'litres', 'liters', 'gallons', 'gal', 'volumen', 'amount', 'litros', 'galones', 'agua'] },
    { key: 'source', label: 'Source', type: 'text', required: false, aliases: ['source', 'watersource', 'fuente', 'origen'] },
    { key: 'fertiliser', label: 'Fertiliser added', type: 'boolean', required: false, aliases: ['fertiliser', 'fertilizer', 'fertilised', 'fertilizante', 'abono', 'confertilizante'] },
    { key: 'notes', label: 'Notes', type: 'text', required: false, aliases: ['notes', 'note', 'comment', 'notas'] },
  ],
  'moisture-readings': [
    { key: 'plotLabel', label: 'Plot', type: 'text', required: true, aliases: ['plot', 'plotlabel', 'bed', 'parcela', 'sensor'] },
    { key: 'takenAt', label: 'Date and time', type: 'datetime', required: true, aliases: ['takenat', 'date', 'datetime', 'time', 'timestamp', 'fecha', 'fechayhora', 'hora'] },
    { key: 'method', label: 'Method (vwc, tensiometer, probe_index)', type: 'text', required: true, aliases: ['method', 'metodo', 'sensor_type', 'sensortype'] },
    { key: 'depthCm', label: 'Depth (cm)', type: 'number', required: true, aliases: ['depthcm', 'depth', 'profundidad'] },
    { key: 'value', label: 'Reading', type: 'number', required: true, aliases: ['value', 'reading', 'vwc', 'moisture', 'kpa', 'valor', 'lectura', 'humedad'] },
  ],
  harvests: [
    { key: 'plotLabel', label: 'Plot', type: 'text', required: true, aliases: ['plot', 'plotlabel', 'bed', 'parcela'] },
    { key: 'harvestedOn', label: 'Day', type: 'date', required: true, aliases: ['harvestedon', 'date', 'day', 'fecha', 'dia'] },
    { key: 'freshKg', label: 'Fresh mass', type: 'number', required: true, quantity: 'mass', aliases: ['freshkg', 'fresh', 'mass', 'weight', 'kg', 'lb', 'peso', 'pesofresco'] },
    { key: 'marketableKg', label: 'Marketable mass', type: 'number', required: false, quantity: 'mass', aliases: ['marketablekg', 'marketable', 'comercial', 'pesocomercial', 'comercializable', 'pesocomercializable'] },
    { key: 'count', label: 'Count', type: 'integer', required: false, aliases: ['count', 'fruits', 'number', 'cantidad', 'frutos', 'unidades'] },
    { key: 'notes', label: 'Notes', type: 'text', required: false, aliases: ['notes', 'note', 'comment', 'notas'] },
  ],
  'weather-days': [
    { key: 'day', label: 'Day', type: 'date', required: true, aliases: ['day', 'date', 'fecha', 'dia'] },
    { key: 'tMinC', label: 'Minimum temperature', type: 'number', required: true, quantity: 'temperature', aliases: ['tminc', 'tmin', 'min', 'mintemp', 'minimum', 'minima', 'tempmin', 'temperaturaminima'] },
    { key: 'tMaxC', label: 'Maximum temperature', type: 'number', required: true, quantity: 'temperature', aliases: ['tmaxc', 'tmax', 'max', 'maxtemp', 'maximum', 'maxima', 'tempmax', 'temperaturamaxima'] },
    { key: 'rainMm', label: 'Rain', type: 'number', required: false, quantity: 'length-small', aliases: ['rainmm', 'rain', 'precip', 'precipitation', 'lluvia'] },
    { key: 'rhMinPct', label: 'Humidity min (%)', type: 'number', required: false, aliases: ['rhminpct', 'rhmin', 'humiditymin', 'hrmin', 'humedadmin', 'humedadminima'] },
    { key: 'rhMaxPct', label: 'Humidity max (%)', type: 'number', required: false, aliases: ['rhmaxpct', 'rhmax', 'humiditymax', 'hrmax', 'humedadmax', 'humedadmaxima'] },
    { key: 'windSpeedMs', label: 'Wind at 2 m (m/s)', type: 'number', required: false, aliases: ['windspeedms', 'wind', 'windspeed', 'viento', 'velocidaddelviento', 'vientoa2m'] },
    { key: 'sunshineHours', label: 'Sunshine hours', type: 'number', required: false, aliases: ['sunshinehours', 'sunshine', 'sun', 'horasdesol', 'insolacion'] },
  ],
};

/** Which column index fills each field; undefined = not imported. */
export type ColumnMapping = Record<string, number | undefined>;

function normaliseHeader(h: string): string {
  return h
    .toLowerCase()
    .normalize('NFD')
    .replace(/[\u0300-\u036f]/g, '')
    .replace(/\(.*?\)/g, '')
    .replace(/[^a-z0-9]/g, '');
}

/** Maps headers to fields by name; each header used once, exact aliases first. */
export function guessMapping(headers: string[], kind: ImportKind): ColumnMapping {
  const norm = headers.map(normaliseHeader);
  const used = new Set<number>();
  const mapping: ColumnMapping = {};
  for (const f of importFields[kind]) {
    const idx = norm.findIndex((h, i) => !used.has(i) && (h === normaliseHeader(f.key) || f.aliases.includes(h)));
    if (idx >= 0) {
      mapping[f.key] = idx;
      used.add(idx);
    }
  }
  return mapping;
}

/** Unit guessed from a header such as "volume (gal)" or "temp_f". */
export function guessUnit(header: string, quantity: Quantity): 'metric' | 'us' {
  const h = header.toLowerCase();
  if (quantity === 'volume') return /gal/.test(h) ? 'us' : 'metric';
  if (quantity === 'mass') return /\blb|pound|lbs/.test(h) ? 'us' : 'metric';
  if (quantity === 'temperature') return /°f|\(f\)|_f\b|fahrenheit/.test(h) ? 'us' : 'metric';
  if (quantity === 'length-small') return /\bin\b|inch|\(in\)/.test(h) ? 'us' : 'metric';
  return 'metric';
}

export type DateFormat = 'iso' | 'dmy' | 'mdy';

const isoRe = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{1,2}):(\d{2})(?::(\d{2})(?:\.\d+)?)?\s*(Z|[+-]\d{2}:?\d{2})?)?$/;
const slashRe = /^(\d{1,2})[/.-](\d{1,2})[/.-](\d{4})(?:[ T](\d{1,2}):(\d{2})(?::(\d{2}))?)?$/;

const monthDays = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** Gregorian calendar: February has 29 days in years divisible by 4, except centuries not divisible by 400. */
function validYmd(y: number, m: number, d: number): boolean {
  if (m < 1 || m > 12 || d < 1) return false;
  const leap = m === 2 && y % 4 === 0 && (y % 100 !== 0 || y % 400 === 0);
  return d <= monthDays[m - 1]! + (leap ? 1 : 0);
}

export interface DateDetection {
  /** The format to use, or null when none fits every sample. */
  format: DateFormat | null;
  /** True when both day-first and month-first fit every sample: the user must choose. */
  ambiguous: boolean;
  candidates: DateFormat[];
}

/** Tries each format on the samples; a format is a candidate only if every sample fits it. */
export function detectDateFormat(samples: string[]): DateDetection {
  const formats: DateFormat[] = ['iso', 'dmy', 'mdy'];
  // A value no format reads ("ayer", "31/04/2027") says nothing about the file's format: it is left
  // out here and shows up as that row's own problem, with its line, once a format is chosen.
  const values = samples.map((s) => s.trim()).filter((v) => v && formats.some((f) => parseDateParts(v, f) !== null));
  const fits = (f: DateFormat) => values.length > 0 && values.every((v) => parseDateParts(v, f) !== null);
  const candidates = formats.filter(fits);
  const ambiguous = candidates.includes('dmy') && candidates.includes('mdy');
  return { format: ambiguous ? null : (candidates[0] ?? null), ambiguous, candidates };
}

/** A parsed cell: the wall-clock time it names, and its own UTC offset or zone letter when it has one. */
interface DateParts extends WallClock {
  zone: string | null;
}

function parseDateParts(value: string, format: DateFormat): DateParts | null {
  const v = value.trim();
  if (format === 'iso') {
    const m = isoRe.exec(v);
    if (!m) return null;
    const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])];
    if (!validYmd(y, mo, d)) return null;
    return { y, m: mo, d, hh: Number(m[4] ?? 0), mm: Number(m[5] ?? 0), ss: Number(m[6] ?? 0), zone: m[7] ?? null };
  }
  const m = slashRe.exec(v);
  if (!m) return null;
  const a = Number(m[1]);
  const b = Number(m[2]);
  const y = Number(m[3]);
  const [d, mo] = format === 'dmy' ? [a, b] : [b, a];
  if (!validYmd(y, mo, d)) return null;
  return { y, m: mo, d, hh: Number(m[4] ?? 0), mm: Number(m[5] ?? 0), ss: Number(m[6] ?? 0), zone: null };
}

const pad = (n: number, w = 2) => String(n).padStart(w, '0');

/** A calendar day 'YYYY-MM-DD', or null. */
export function parseDay(value: string, format: DateFormat): string | null {
  const p = parseDateParts(value, format);
  return p ? `${p.y}-${pad(p.m)}-${pad(p.d)}` : null;
}

/**
 * An instant as ISO 8601 UTC. Times without a zone are wall-clock times of the garden, read in its
 * IANA time zone with the offset in force on that day (summer time included); a date alone is the
 * start of that calendar day in the garden.
 */
export function parseInstant(value: string, format: DateFormat, timeZone: string): string | null {
  const p = parseDateParts(value, format);
  if (!p) return null;
  if (p.hh > 23 || p.mm > 59 || p.ss > 59) return null;
  if (!p.zone) return new Date(instantOfWallClock(p, timeZone)).toISOString();
  let ms = Date.UTC(p.y, p.m - 1, p.d, p.hh, p.mm, p.ss);
  if (p.zone !== 'Z') {
    const sign = p.zone.startsWith('-') ? -1 : 1;
    const digits = p.zone.replace(/[^0-9]/g, '');
    ms -= sign * (Number(digits.slice(0, 2)) * 60 + Number(digits.slice(2, 4))) * 60_000;
  }
  return new Date(ms).toISOString();
}

/**
 * What is wrong with a row, as a code the client words in the reader's language (`params` fill
 * in the words); `reason` keeps the same message in English for logs, the API and older clients.
 * Errors found by the server's record schema are `invalidValue` with the issue's facts (`reason` is
 * the schema's own message) and `column` the record's field key.
 */
export type RowErrorCode =
  | 'missingColumn'
  | 'fieldCount'
  | 'empty'
  | 'notBoolean'
  | 'notNumber'
  | 'notWholeNumber'
  | 'notDate'
  | 'notDateTime'
  | 'unknownPlot'
  | 'outsideTrial'
  /** The server's record schema refused a value: `issue` has zod's facts, `reason` the schema's English message. */
  | 'invalidValue'
  | 'notRecord'
  | 'nulCharacter';

/** What the client needs to word a schema issue itself (as the server's `validation_failed` details carry). */
export type RowIssue = Record<string, string | number | boolean> & { code: string };

export interface RowError {
  /** 1-based line in the file, counting the header as line 1. */
  line: number;
  column: string;
  reason: string;
  code?: RowErrorCode;
  params?: Record<string, string | number>;
  issue?: RowIssue;
}

export interface ImportOptions {
  kind: ImportKind;
  mapping: ColumnMapping;
  /** Unit system per quantity field key. */
  units: Record<string, 'metric' | 'us'>;
  dateFormat: DateFormat;
  /** The garden's IANA time zone: times without an offset are its wall-clock times. */
  timeZone: string;
  headers: string[];
}

export type NormalisedRow = Record<string, string | number | boolean | null> & { line: number };

function parseNumber(raw: string): number | null {
  // Accept a decimal comma when there is no other separator ("2,5").
  const s = /\s/.test(raw) ? raw.replace(/\s/g, '') : raw;
  const v = /^-?\d+,\d+$/.test(s) ? Number(s.replace(',', '.')) : Number(s);
  return s === '' || !Number.isFinite(v) ? null : v;
}

function parseBoolean(raw: string): boolean | null {
  const s = raw.trim().toLowerCase();
  if (['yes', 'y', 'true', 't', '1', 'si', 'sí', 'x'].includes(s)) return true;
  if (['no', 'n', 'false', 'f', '0', ''].includes(s)) return false;
  return null;
}

const kindAliases: Record<string, string> = { refill: 'olla_refill', olla: 'olla_refill', olla_refill: 'olla_refill', ollarefill: 'olla_refill', surface: 'surface', can: 'surface', hose: 'surface', superficie: 'surface' };

/**
 * Converts raw rows into records with SI values, listing every problem (line, column, reason).
 * Field-level rules of the record itself (ranges, allowed values) are checked again on the server.
 */
export function normaliseRows(rows: string[][], o: ImportOptions): { records: NormalisedRow[]; errors: RowError[] } {
  const fields = importFields[o.kind];
  const errors: RowError[] = [];
  const records: NormalisedRow[] = [];
  const missing = fields.filter((f) => f.required && o.mapping[f.key] === undefined);
  if (missing.length) {
    return {
      records,
      errors: missing.map((f) => ({ line: 1, column: f.label, reason: `No column is mapped to "${f.label}", which is required.`, code: 'missingColumn' as const, params: { field: f.key } })),
    };
  }
  rows.forEach((row, i) => {
    const line = i + 2;
    if (row.length !== o.headers.length) {
      errors.push({
        line,
        column: '',
        reason: `This row has ${row.length} field${row.length === 1 ? '' : 's'}; the header has ${o.headers.length}.`,
        code: 'fieldCount',
        params: { count: row.length, expected: o.headers.length },
      });
      return;
    }
    const rec: NormalisedRow = { line };
    let ok = true;
    for (const f of fields) {
      const idx = o.mapping[f.key];
      if (idx === undefined) continue;
      const raw = (row[idx] ?? '').trim();
      const column = o.headers[idx] ?? f.label;
      const fail = (reason: string, code: RowErrorCode) => {
        errors.push({ line, column, reason, code, params: { value: raw, field: f.key } });
        ok = false;
      };
      if (raw === '') {
        // An empty optional cell is left out, so the record's own default applies.
        if (f.required) fail(`${f.label} is empty.`, 'empty');
        continue;
      }
      switch (f.type) {
        case 'text':
          rec[f.key] = f.key === 'kind' ? (kindAliases[raw.toLowerCase().replace(/[\s-]/g, '_')] ?? raw) : raw;
          break;
        case 'boolean': {
          const b = parseBoolean(raw);
          if (b === null) fail(`"${raw}" is not yes or no.`, 'notBoolean');
          else rec[f.key] = b;
          break;
        }
        case 'number':
        case 'integer': {
          const n = parseNumber(raw);
          if (n === null) fail(`"${raw}" is not a number.`, 'notNumber');
          else if (f.type === 'integer' && !Number.isInteger(n)) fail(`"${raw}" is not a whole number.`, 'notWholeNumber');
          else rec[f.key] = f.quantity ? fromDisplay(n, f.quantity, o.units[f.key] ?? 'metric') : n;
          break;
        }
        case 'date': {
          const d = parseDay(raw, o.dateFormat);
          if (!d) fail(`"${raw}" is not a date in the chosen format.`, 'notDate');
          else rec[f.key] = d;
          break;
        }
        case 'datetime': {
          const d = parseInstant(raw, o.dateFormat, o.timeZone);
          if (!d) fail(`"${raw}" is not a date and time in the chosen format.`, 'notDateTime');
          else rec[f.key] = d;
          break;
        }
      }
    }
    if (ok) records.push(rec);
  });
  return { records, errors };
}
