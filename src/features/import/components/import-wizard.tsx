import { useEffect, useMemo, useRef, useState } from 'react';
import {
  detectDateFormat,
  guessMapping,
  guessUnit,
  importFields,
  importKinds,
  normaliseRows,
  type ColumnMapping,
  type DateFormat,
  type ImportKind,
  type RowError,
} from '@shared/import/csv-import';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { sendImport, serverRowErrors, useAfterImport, type ImportResult } from '../api/import-rows';
import type { WorkerMessage } from '../worker/parse-csv.worker';

export const MAX_FILE_BYTES = 50 * 1024 * 1024;

const kindLabels: Record<ImportKind, string> = {
  'water-events': 'Water (refills and surface watering)',
  'moisture-readings': 'Soil moisture readings',
  harvests: 'Harvests',
  'weather-days': 'Weather days',
};

const dateFormatLabels: Record<DateFormat, string> = { iso: 'Year-month-day (2027-04-03)', dmy: 'Day/month/year (03/04/2027 = 3 April)', mdy: 'Month/day/year (03/04/2027 = 4 March)' };

interface Parsed {
  fileName: string;
  headers: string[];
  rows: string[][];
  encoding: string;
  warnings: string[];
}

function Progress({ label, fraction }: { label: string; fraction: number }) {
  const pct = Math.round(fraction * 100);
  return (
    <div className="space-y-1">
      <div className="flex justify-between text-sm">
        <span>{label}</span>
        <span>{pct}%</span>
      </div>
      <div role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} className="h-3 overflow-hidden rounded bg-sand-200">
        <div className="h-full bg-terracotta-600 transition-[width]" style={{ width: `${pct}%` }} />
      </div>
    </div>
  );
}

function ErrorList({ errors, total }: { errors: RowError[]; total: number }) {
  return (
    <div className="max-h-72 overflow-auto rounded-card border border-red-200 bg-white">
      <table className="w-full text-sm">
        <caption className="px-3 pt-2 text-left font-semibold text-red-900">
          {total} problem{total === 1 ? '' : 's'}
          {total > errors.length ? ` (first ${errors.length} shown)` : ''}
        </caption>
        <thead className="text-left text-ink-muted">
          <tr>
            <th scope="col" className="px-3 py-1">Line</th>
            <th scope="col" className="px-3 py-1">Column</th>
            <th scope="col" className="px-3 py-1">Problem</th>
          </tr>
        </thead>
        <tbody>
          {errors.map((e, i) => (
            <tr key={i} className="border-t border-sand-100">
              <td className="num px-3 py-1">{e.line}</td>
              <td className="px-3 py-1">{e.column || '—'}</td>
              <td className="px-3 py-1">{e.reason}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/**
 * CSV import: choose the kind and file → parse in a worker (progress) → map columns, units and
 * the date format → preview with every row problem → send (progress) → one transaction on the
 * server. Nothing is written until the whole file is valid.
 */
export function ImportWizard({ trialId, userId }: { trialId: string; userId: string }) {
  const [kind, setKind] = useState<ImportKind>('water-events');
  const [parseProgress, setParseProgress] = useState<number | null>(null);
  const [sendProgress, setSendProgress] = useState<number | null>(null);
  const [parsed, setParsed] = useState<Parsed | null>(null);
  const [mapping, setMapping] = useState<ColumnMapping>({});
  const [units, setUnits] = useState<Record<string, 'metric' | 'us'>>({});
  const [dateFormat, setDateFormat] = useState<DateFormat | ''>('');
  const [message, setMessage] = useState<{ tone: 'error' | 'success' | 'warning'; text: string } | null>(null);
  const [serverErrors, setServerErrors] = useState<{ total: number; rows: RowError[] } | null>(null);
  const [result, setResult] = useState<ImportResult | null>(null);
  const fileInput = useRef<HTMLInputElement>(null);
  const afterImport = useAfterImport(trialId);
  const storageKey = `seepwise.import-mapping.${userId}.${kind}`;
  const fields = importFields[kind];

  const dateField = fields.find((f) => f.type === 'date' || f.type === 'datetime')!;
  const detection = useMemo(() => {
    const idx = mapping[dateField.key];
    if (!parsed || idx === undefined) return null;
    return detectDateFormat(parsed.rows.slice(0, 500).map((r) => r[idx] ?? ''));
  }, [parsed, mapping, dateField.key]);

  const normalised = useMemo(() => {
    if (!parsed || !dateFormat) return null;
    return normaliseRows(parsed.rows, { kind, mapping, units, dateFormat, offsetMinutes: -new Date().getTimezoneOffset(), headers: parsed.headers });
  }, [parsed, kind, mapping, units, dateFormat]);

  const reset = () => {
    setParsed(null);
    setParseProgress(null);
    setSendProgress(null);
    setMessage(null);
    setServerErrors(null);
    setResult(null);
    setDateFormat('');
  };

  const onFile = (file: File | undefined) => {
    reset();
    if (!file) return;
    if (file.size === 0) return setMessage({ tone: 'error', text: 'The file is empty.' });
    if (file.size > MAX_FILE_BYTES) return setMessage({ tone: 'error', text: `The file is ${(file.size / 1048576).toFixed(0)} MB; files up to 50 MB can be imported. Split it by month or by plot.` });
    setParseProgress(0);
    const worker = new Worker(new URL('../worker/parse-csv.worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (ev: MessageEvent<WorkerMessage>) => {
      const m = ev.data;
      if (m.type === 'progress') setParseProgress(m.fraction);
      else if (m.type === 'error') {
        setMessage({ tone: 'error', text: m.message });
        setParseProgress(null);
        worker.terminate();
      } else {
        worker.terminate();
        setParsed({ fileName: file.name, headers: m.headers, rows: m.rows, encoding: m.encoding, warnings: m.warnings });
        // The last mapping this user chose for this kind, where the same headers exist; otherwise a guess by name.
        const saved = JSON.parse(localStorage.getItem(storageKey) ?? '{}') as Record<string, string>;
        const guessed = guessMapping(m.headers, kind);
        const next: ColumnMapping = {};
        for (const f of importFields[kind]) {
          const savedIdx = saved[f.key] ? m.headers.indexOf(saved[f.key]!) : -1;
          next[f.key] = savedIdx >= 0 ? savedIdx : guessed[f.key];
        }
        setMapping(next);
        const u: Record<string, 'metric' | 'us'> = {};
        for (const f of importFields[kind]) if (f.quantity && next[f.key] !== undefined) u[f.key] = guessUnit(m.headers[next[f.key]!] ?? '', f.quantity);
        setUnits(u);
        const mapped = Object.values(next).filter((v) => v !== undefined).length;
        if (mapped === 0) setMessage({ tone: 'warning', text: 'None of the column names matched. Choose which column holds what below.' });
      }
    };
    worker.onerror = () => {
      setMessage({ tone: 'error', text: 'The file could not be parsed.' });
      setParseProgress(null);
    };
    worker.postMessage({ file });
  };

  // An unambiguous detection is applied at once; an ambiguous one waits for the user's choice.
  useEffect(() => {
    if (detection && !detection.ambiguous && detection.format) setDateFormat(detection.format);
    else if (detection?.ambiguous) setDateFormat('');
  }, [detection]);

  const send = async () => {
    if (!parsed || !normalised || normalised.errors.length) return;
    setMessage(null);
    setServerErrors(null);
    setSendProgress(0);
    localStorage.setItem(storageKey, JSON.stringify(Object.fromEntries(Object.entries(mapping).flatMap(([k, v]) => (v === undefined ? [] : [[k, parsed.headers[v]]])))));
    try {
      const r = await sendImport(trialId, kind, normalised.records, parsed.fileName, setSendProgress);
      setResult(r);
      await afterImport();
    } catch (err) {
      setServerErrors(serverRowErrors(err));
      setMessage({ tone: 'error', text: (err as Error).message });
    } finally {
      setSendProgress(null);
    }
  };

  return (
    <section aria-labelledby="import-heading" className="space-y-4 rounded-card border border-sand-200 bg-white p-4">
      <h2 id="import-heading">Import from a CSV file</h2>
      <p className="text-sm text-ink-muted">
        From a spreadsheet or a soil-moisture logger. Seepwise checks every row first; if any row has a problem nothing is imported, and the list tells you
        which line and column to fix. Importing the same file twice adds nothing.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="What the file holds"
          value={kind}
          onChange={(e) => {
            setKind(e.target.value as ImportKind);
            reset();
            if (fileInput.current) fileInput.current.value = '';
          }}
        >
          {importKinds.map((k) => (
            <option key={k} value={k}>
              {kindLabels[k]}
            </option>
          ))}
        </SelectField>
        <div className="space-y-1">
          <label htmlFor="import-file" className="block text-sm font-medium">
            CSV file (up to 50 MB)
          </label>
          <input
            id="import-file"
            ref={fileInput}
            type="file"
            accept=".csv,text/csv,text/plain"
            className="block w-full rounded-lg border border-sand-300 bg-white px-3 py-2 text-sm"
            onChange={(e) => onFile(e.target.files?.[0])}
          />
        </div>
      </div>
      {parseProgress !== null && !parsed ? <Progress label="Reading the file" fraction={parseProgress} /> : null}
      {message ? <Alert tone={message.tone}>{message.text}</Alert> : null}
      {parsed ? (
        <div className="space-y-4">
          <p className="text-sm">
            <strong>{parsed.fileName}</strong>: {parsed.rows.length.toLocaleString()} rows, {parsed.headers.length} columns
            {parsed.encoding !== 'utf-8' ? ' — read as Latin-1 (Windows-1252) because it is not UTF-8; check accented names in the preview.' : '.'}
          </p>
          {parsed.warnings.map((w) => (
            <Alert key={w} tone="warning">
              {w}
            </Alert>
          ))}
          <fieldset className="grid gap-3 sm:grid-cols-3">
            <legend className="mb-2 text-base font-semibold">Which column holds what</legend>
            {fields.map((f) => (
              <div key={f.key} className="space-y-1">
                <SelectField
                  label={`${f.label}${f.required ? ' *' : ''}`}
                  value={mapping[f.key] === undefined ? '' : String(mapping[f.key])}
                  onChange={(e) => setMapping((m) => ({ ...m, [f.key]: e.target.value === '' ? undefined : Number(e.target.value) }))}
                >
                  <option value="">— not in this file —</option>
                  {parsed.headers.map((h, i) => (
                    <option key={i} value={i}>
                      {h || `(column ${i + 1})`}
                    </option>
                  ))}
                </SelectField>
                {f.quantity && mapping[f.key] !== undefined ? (
                  <SelectField label={`Unit of ${f.label.toLowerCase()}`} value={units[f.key] ?? 'metric'} onChange={(e) => setUnits((u) => ({ ...u, [f.key]: e.target.value as 'metric' | 'us' }))}>
                    <option value="metric">{f.quantity === 'volume' ? 'litres' : f.quantity === 'mass' ? 'kilograms' : f.quantity === 'temperature' ? '°C' : 'mm'}</option>
                    <option value="us">{f.quantity === 'volume' ? 'US gallons' : f.quantity === 'mass' ? 'pounds' : f.quantity === 'temperature' ? '°F' : 'inches'}</option>
                  </SelectField>
                ) : null}
              </div>
            ))}
          </fieldset>
          {detection ? (
            detection.candidates.length === 0 ? (
              <Alert tone="error">The dates in column “{parsed.headers[mapping[dateField.key]!]}” match none of the formats Seepwise reads (2027-04-03, 03/04/2027).</Alert>
            ) : (
              <SelectField
                label="Date format"
                value={dateFormat}
                hint={detection.ambiguous ? 'Every date here could be day-first or month-first (like 03/04/2027). Choose which your file uses.' : `Detected: ${dateFormatLabels[detection.format!]}.`}
                onChange={(e) => setDateFormat(e.target.value as DateFormat)}
              >
                <option value="">Choose…</option>
                {detection.candidates.map((f) => (
                  <option key={f} value={f}>
                    {dateFormatLabels[f]}
                  </option>
                ))}
              </SelectField>
            )
          ) : null}
          {normalised ? (
            <>
              {normalised.errors.length ? (
                <ErrorList errors={normalised.errors.slice(0, 300)} total={normalised.errors.length} />
              ) : (
                <Alert tone="success">All {normalised.records.length.toLocaleString()} rows are ready to import.</Alert>
              )}
              <div className="overflow-x-auto">
                <table className="w-full text-sm">
                  <caption className="text-left font-semibold">Preview (first 10 rows, as they will be stored)</caption>
                  <thead className="bg-sand-100 text-left">
                    <tr>
                      <th scope="col" className="px-2 py-1">Line</th>
                      {fields.filter((f) => mapping[f.key] !== undefined).map((f) => (
                        <th key={f.key} scope="col" className="px-2 py-1">
                          {f.label}
                          {f.quantity ? ` (${f.quantity === 'volume' ? 'L' : f.quantity === 'mass' ? 'kg' : f.quantity === 'temperature' ? '°C' : 'mm'})` : ''}
                        </th>
                      ))}
                    </tr>
                  </thead>
                  <tbody>
                    {normalised.records.slice(0, 10).map((r) => (
                      <tr key={r.line} className="border-t border-sand-100">
                        <td className="num px-2 py-1">{r.line}</td>
                        {fields.filter((f) => mapping[f.key] !== undefined).map((f) => (
                          <td key={f.key} className="px-2 py-1">
                            {r[f.key] === undefined || r[f.key] === null ? '—' : typeof r[f.key] === 'number' ? Number((r[f.key] as number).toFixed(3)) : String(r[f.key])}
                          </td>
                        ))}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </>
          ) : null}
          {sendProgress !== null ? <Progress label="Sending" fraction={sendProgress} /> : null}
          {serverErrors ? <ErrorList errors={serverErrors.rows} total={serverErrors.total} /> : null}
          {result ? (
            <Alert tone="success">
              Imported {result.inserted.toLocaleString()} record{result.inserted === 1 ? '' : 's'}
              {result.alreadyImported ? `; ${result.alreadyImported.toLocaleString()} were already imported and were skipped` : ''}.
            </Alert>
          ) : null}
          <Button onClick={() => void send()} disabled={!normalised || normalised.errors.length > 0 || normalised.records.length === 0 || sendProgress !== null}>
            Import {normalised?.records.length ? normalised.records.length.toLocaleString() : ''} rows
          </Button>
        </div>
      ) : null}
    </section>
  );
}
