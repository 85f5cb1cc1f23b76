import { describe, expect, it } from 'vitest';
import { detectDateFormat, guessMapping, guessUnit, importFields, importKinds, normaliseRows, parseInstant } from '@shared/import/csv-import';
import esImport from '@/locales/es/import.json';

describe('detectDateFormat', () => {
  it.each([
    [['2027-05-03', '2027-05-04T07:30'], 'iso', false],
    [['13/04/2027', '03/04/2027'], 'dmy', false],
    [['04/13/2027', '04/03/2027'], 'mdy', false],
    [['03/04/2027', '05/06/2027'], null, true],
    [['yesterday'], null, false],
  ])('%j → %s (ambiguous: %s)', (samples, format, ambiguous) => {
    const d = detectDateFormat(samples);
    expect(d.format).toBe(format);
    expect(d.ambiguous).toBe(ambiguous);
  });

  it('reads the format from the dates it can read; an unreadable one is that row’s problem, with its line', () => {
    const d = detectDateFormat(['2027-05-03 07:00', 'ayer', '2027-05-04 07:00']);
    expect(d).toMatchObject({ format: 'iso', ambiguous: false });
    const headers = ['fecha', 'parcela', 'tipo', 'litros'];
    const rows = [
      ['2027-05-03 07:00', 'A1', 'olla', '2'],
      ['ayer', 'A1', 'olla', '2'],
    ];
    const r = normaliseRows(rows, { kind: 'water-events', mapping: guessMapping(headers, 'water-events'), units: {}, dateFormat: d.format!, timeZone: 'UTC', headers });
    expect(r.records).toHaveLength(1);
    expect(r.errors).toEqual([expect.objectContaining({ line: 3, column: 'fecha', code: 'notDateTime', params: { value: 'ayer', field: 'occurredAt' } })]);
  });

  it('refuses impossible days (31 April, 29 February 2027)', () => {
    expect(detectDateFormat(['2027-04-31']).format).toBeNull();
    expect(detectDateFormat(['29/02/2027']).candidates).toEqual([]);
    expect(detectDateFormat(['29/02/2028']).candidates).toEqual(['dmy']); // 2028 is a leap year
  });

  it('follows the Gregorian leap-year rule for centuries (ISO 8601 uses the Gregorian calendar: 2000 is a leap year, 2100 is not)', () => {
    expect(detectDateFormat(['2000-02-29']).format).toBe('iso');
    expect(detectDateFormat(['2100-02-29']).format).toBeNull();
    expect(detectDateFormat(['2024-12-31', '2024-06-30']).format).toBe('iso');
    expect(detectDateFormat(['2024-06-31']).format).toBeNull();
  });
});

describe('parseInstant', () => {
  // Offsets from the IANA tz database (tzdata, as ICU ships it): America/Regina is Central Standard
  // Time all year (UTC−6, no summer time); America/Denver is MST (UTC−7) in winter and MDT (UTC−6)
  // from the second Sunday of March to the first Sunday of November (US rule since 2007).
  it('reads local times in the garden time zone and honours explicit zones', () => {
    expect(parseInstant('2027-06-01 07:00', 'iso', 'America/Regina')).toBe('2027-06-01T13:00:00.000Z'); // UTC−6
    expect(parseInstant('2027-06-01T07:00:00Z', 'iso', 'America/Regina')).toBe('2027-06-01T07:00:00.000Z');
    expect(parseInstant('2027-06-01T07:00:00+02:00', 'iso', 'UTC')).toBe('2027-06-01T05:00:00.000Z');
    expect(parseInstant('01/06/2027 07:00', 'dmy', 'UTC')).toBe('2027-06-01T07:00:00.000Z');
    expect(parseInstant('2027-06-01 25:00', 'iso', 'UTC')).toBeNull();
  });

  it('uses the offset in force on that day (summer time), not one offset for the whole file', () => {
    expect(parseInstant('2027-01-15 07:00', 'iso', 'America/Denver')).toBe('2027-01-15T14:00:00.000Z'); // MST, UTC−7
    expect(parseInstant('2027-06-15 07:00', 'iso', 'America/Denver')).toBe('2027-06-15T13:00:00.000Z'); // MDT, UTC−6
  });

  it('reads a date alone as the start of that calendar day in the garden', () => {
    // America/Los_Angeles in June: Pacific Daylight Time, UTC−7 (IANA tz database).
    expect(parseInstant('2027-06-01', 'iso', 'America/Los_Angeles')).toBe('2027-06-01T07:00:00.000Z');
    expect(parseInstant('01/06/2027', 'dmy', 'Europe/Madrid')).toBe('2027-05-31T22:00:00.000Z'); // CEST, UTC+2
  });
});

describe('guessMapping and guessUnit', () => {
  it('maps spreadsheet headers to fields, ignoring case, accents and units in brackets', () => {
    const headers = ['Fecha', 'Parcela', 'Tipo', 'Volume (gal)', 'Notas', 'Extra'];
    expect(guessMapping(headers, 'water-events')).toEqual({ occurredAt: 0, plotLabel: 1, kind: 2, volumeL: 3, notes: 4 });
    expect(guessUnit('Volume (gal)', 'volume')).toBe('us');
    expect(guessUnit('Tmax (°F)', 'temperature')).toBe('us');
    expect(guessUnit('litres', 'volume')).toBe('metric');
  });

  it('maps Spanish headers: the wizard’s own Spanish field names, and common ones like "litros" or "abono"', () => {
    const es = esImport.fields as Record<string, string>;
    for (const kind of importKinds) {
      const fields = importFields[kind];
      const mapping = guessMapping(fields.map((f) => es[f.key]!), kind);
      expect(mapping, kind).toEqual(Object.fromEntries(fields.map((f, i) => [f.key, i])));
    }
    expect(guessMapping(['fecha', 'parcela', 'riego', 'litros', 'abono', 'observaciones'], 'water-events')).toEqual({ occurredAt: 0, plotLabel: 1, kind: 2, volumeL: 3, fertiliser: 4 });
    expect(guessUnit('Galones', 'volume')).toBe('us');
  });
});

describe('normaliseRows', () => {
  const headers = ['date', 'plot', 'kind', 'volume', 'fertiliser'];
  const base = { kind: 'water-events' as const, mapping: guessMapping(headers, 'water-events'), dateFormat: 'iso' as const, timeZone: 'UTC', headers };

  it('converts gallons to litres with the exact US gallon (NIST Handbook 44: 3.785411784 L)', () => {
    const { records, errors } = normaliseRows([['2027-06-01 07:00', 'A1', 'refill', '2', 'yes']], { ...base, units: { volumeL: 'us' } });
    expect(errors).toEqual([]);
    expect(records[0]).toMatchObject({ line: 2, plotLabel: 'A1', kind: 'olla_refill', volumeL: 7.570823568, fertiliser: true });
  });

  it('lists every row problem with its line and column', () => {
    const { records, errors } = normaliseRows(
      [
        ['2027-06-01 07:00', 'A1', 'surface', 'lots', 'no'],
        ['2027-06-31 07:00', 'A1', 'surface', '4', 'maybe'],
        ['2027-06-02 07:00', 'A1', 'surface', '4', 'no', 'extra'],
        ['2027-06-03 07:00', 'A1', 'surface', '2,5', ''],
      ],
      { ...base, units: {} },
    );
    expect(errors).toEqual([
      { line: 2, column: 'volume', reason: '"lots" is not a number.', code: 'notNumber', params: { value: 'lots', field: 'volumeL' } },
      {
        line: 3,
        column: 'date',
        reason: '"2027-06-31 07:00" is not a date and time in the chosen format.',
        code: 'notDateTime',
        params: { value: '2027-06-31 07:00', field: 'occurredAt' },
      },
      { line: 3, column: 'fertiliser', reason: '"maybe" is not yes or no.', code: 'notBoolean', params: { value: 'maybe', field: 'fertiliser' } },
      { line: 4, column: '', reason: 'This row has 6 fields; the header has 5.', code: 'fieldCount', params: { count: 6, expected: 5 } },
    ]);
    expect(records).toHaveLength(1);
    expect(records[0]!.volumeL).toBe(2.5);
  });

  it('says which required field has no column', () => {
    const { errors } = normaliseRows([['x']], { kind: 'water-events', mapping: {}, units: {}, dateFormat: 'iso', timeZone: 'UTC', headers: ['x'] });
    expect(errors.map((e) => e.reason)).toContain('No column is mapped to "Volume", which is required.');
    expect(errors).toContainEqual(expect.objectContaining({ code: 'missingColumn', params: { field: 'volumeL' } }));
  });
});
