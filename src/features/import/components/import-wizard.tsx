import type { TFunction } from 'i18next';
import { useEffect, useMemo, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import {
  detectDateFormat,
  guessMapping,
  guessUnit,
  importFields,
  importKinds,
  normaliseRows,
  type ColumnMapping,
  type DateFormat,
  type ImportField,
  type ImportKind,
  type NormalisedRow,
  type RowError,
} from '@shared/import/csv-import';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { schemaMessageKeys as logsSchemaKeys } from '@/features/logs/components/schema-message-keys';
import { formatDate, formatDateTime, formatNumber } from '@/lib/format';
import { issueMessage } from '@/lib/validation-messages';
import type importEn from '@/locales/en/import.json';
import logsEn from '@/locales/en/logs.json';
import { sendImport, serverRowErrors, useAfterImport, type ImportResult } from '../api/import-rows';
import type { WorkerMessage, WorkerWarning } from '../worker/parse-csv.worker';

export const MAX_FILE_BYTES = 50 * 1024 * 1024;

type FieldKey = keyof (typeof importEn)['fields'];
type LowerKey = keyof (typeof importEn)['fieldsLower'];

/** A field of shared/import in the reader's language, by its key (the shared English label when we have no words for it). */
function fieldLabel(t: TFunction<'import'>, key: string, fallback: string): string {
  const k = key as FieldKey;
  return k in fieldKeys ? t(($) => $.fields[k]) : fallback;
}
const fieldKeys: Record<FieldKey, true> = {
  plotLabel: true, occurredAt: true, takenAt: true, kind: true, volumeL: true, source: true, fertiliser: true, notes: true, method: true, depthCm: true, value: true,
  harvestedOn: true, freshKg: true, marketableKg: true, count: true, day: true, tMinC: true, tMaxC: true, rainMm: true, rhMinPct: true, rhMaxPct: true,
  windSpeedMs: true, sunshineHours: true,
};
const lowerKeys: Record<LowerKey, true> = { volumeL: true, freshKg: true, marketableKg: true, tMinC: true, tMaxC: true, rainMm: true };

/**
 * A row problem in the reader's language: by its code (shared/import, the server); a value the
 * server's record schema refused by the schema's own words where the logs forms have them, else
 * by the issue's facts (too small, not one of the choices…); the English reason only as a last resort.
 */
export function rowErrorText(t: TFunction<'import'>, tl: TFunction<'logs'>, e: RowError): string {
  const p = e.params ?? {};
  const value = String(p.value ?? '');
  const field = fieldLabel(t, String(p.field ?? ''), e.column);
  switch (e.code) {
    case 'missingColumn':
      return t(($) => $.rowErrors.missingColumn, { field });
    case 'fieldCount':
      return t(($) => $.rowErrors.fieldCount, { count: Number(p.count), expected: Number(p.expected) });
    case 'empty':
      return t(($) => $.rowErrors.empty, { field });
    case 'notBoolean':
      return t(($) => $.rowErrors.notBoolean, { value });
    case 'notNumber':
      return t(($) => $.rowErrors.notNumber, { value });
    case 'notWholeNumber':
      return t(($) => $.rowErrors.notWholeNumber, { value });
    case 'notDate':
      return t(($) => $.rowErrors.notDate, { value });
    case 'notDateTime':
      return t(($) => $.rowErrors.notDateTime, { value });
    case 'unknownPlot':
      return t(($) => $.rowErrors.unknownPlot, { plot: String(p.plot ?? ''), plots: String(p.plots ?? '') });
    case 'outsideTrial': {
      const facts = { day: formatDate(String(p.day ?? '')), planted: formatDate(String(p.planted ?? '')) };
      return p.ends ? t(($) => $.rowErrors.outsideTrialEnds, { ...facts, ends: formatDate(String(p.ends)) }) : t(($) => $.rowErrors.outsideTrial, facts);
    }
    case 'notRecord':
      return t(($) => $.rowErrors.notRecord);
    case 'nulCharacter':
      return t(($) => $.rowErrors.nulCharacter);
    case 'invalidValue': {
      const own = Object.hasOwn(logsSchemaKeys, e.reason) ? logsSchemaKeys[e.reason] : undefined;
      if (own) return tl(($) => $.schema[own]);
      return e.issue ? issueMessage(e.issue) : e.reason;
    }
    default:
      return e.reason;
  }
}

type LogsEn = typeof logsEn;
const has = <T extends object>(o: T, k: unknown): k is keyof T => typeof k === 'string' && Object.hasOwn(o, k);

/** A previewed value as the reader reads it: dates and numbers in their language, codes by name (stored as SI values and codes). */
function previewCell(tl: TFunction<'logs'>, f: ImportField, v: NormalisedRow[string] | undefined): string {
  if (v === undefined || v === null) return '—';
  if (typeof v === 'number') return formatNumber(v, 3);
  if (typeof v === 'boolean') return v ? tl(($) => $.yes) : tl(($) => $.no);
  if (f.type === 'datetime') return formatDateTime(v);
  if (f.type === 'date') return formatDate(v);
  if (f.key === 'kind' && has<LogsEn['waterKinds']>(logsEn.waterKinds, v)) return tl(($) => $.waterKinds[v]);
  if (f.key === 'source' && has<LogsEn['sources']>(logsEn.sources, v)) return tl(($) => $.sources[v]);
  if (f.key === 'method' && has<LogsEn['methods']>(logsEn.methods, v)) return tl(($) => $.methods[v]);
  return v;
}

const warningText = (t: TFunction<'import'>, w: WorkerWarning) => (w === 'oneColumn' ? t(($) => $.oneColumn) : w);

interface Parsed {
  fileName: string;
  headers: string[];
  rows: string[][];
  encoding: string;
  warnings: WorkerWarning[];
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

/** The column a problem sits in: the file's header as read, or for the server's checks the record's field, worded. */
function columnText(t: TFunction<'import'>, e: RowError): string {
  if (e.code === 'missingColumn') return fieldLabel(t, String(e.params?.field ?? ''), e.column);
  if (e.code === 'unknownPlot') return fieldLabel(t, 'plotLabel', e.column);
  if (e.code === 'invalidValue' || e.code === 'nulCharacter' || e.code === 'outsideTrial') return fieldLabel(t, e.column, e.column);
  return e.column;
}

function ErrorList({ errors, total }: { errors: RowError[]; total: number }) {
  const { t } = useTranslation('import');
  const { t: tl } = useTranslation('logs');
  return (
    <div className="max-h-72 overflow-auto rounded-card border border-red-200 bg-white">
      <table className="w-full text-sm">
        <caption className="px-3 pt-2 text-left font-semibold text-red-900">
          {total > errors.length ? t(($) => $.problemsFirstShown, { count: total, n: formatNumber(errors.length, 0) }) : t(($) => $.problems, { count: total })}
        </caption>
        <thead className="text-left text-ink-muted">
          <tr>
            <th scope="col" className="px-3 py-1">
              {t(($) => $.line)}
            </th>
            <th scope="col" className="px-3 py-1">
              {t(($) => $.column)}
            </th>
            <th scope="col" className="px-3 py-1">
              {t(($) => $.problem)}
            </th>
          </tr>
        </thead>
        <tbody>
          {errors.map((e, i) => (
            <tr key={i} className="border-t border-sand-100">
              <td className="num px-3 py-1">{e.line}</td>
              <td className="px-3 py-1">{columnText(t, e) || '—'}</td>
              <td className="px-3 py-1">{rowErrorText(t, tl, e)}</td>
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
export function ImportWizard({ trialId, userId, timeZone }: { trialId: string; userId: string; timeZone: string }) {
  const { t } = useTranslation('import');
  // The preview and the problem list word values and schema messages from `logs`.
  const { t: tl } = useTranslation('logs');
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
    return normaliseRows(parsed.rows, { kind, mapping, units, dateFormat, timeZone, headers: parsed.headers });
  }, [parsed, kind, mapping, units, dateFormat, timeZone]);

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
    if (file.size === 0) return setMessage({ tone: 'error', text: t(($) => $.fileEmpty) });
    if (file.size > MAX_FILE_BYTES) return setMessage({ tone: 'error', text: t(($) => $.tooBig, { size: formatNumber(file.size / 1048576, 0) }) });
    setParseProgress(0);
    const worker = new Worker(new URL('../worker/parse-csv.worker.ts', import.meta.url), { type: 'module' });
    worker.onmessage = (ev: MessageEvent<WorkerMessage>) => {
      const m = ev.data;
      if (m.type === 'progress') setParseProgress(m.fraction);
      else if (m.type === 'error') {
        const e = m.error;
        setMessage({ tone: 'error', text: e.code === 'unreadable' ? t(($) => $.unreadable, { detail: e.detail }) : e.code === 'noHeader' ? t(($) => $.noHeader) : t(($) => $.fileEmpty) });
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
        if (mapped === 0) setMessage({ tone: 'warning', text: t(($) => $.noMatch) });
      }
    };
    worker.onerror = () => {
      setMessage({ tone: 'error', text: t(($) => $.unparsable) });
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
      <h2 id="import-heading">{t(($) => $.title)}</h2>
      <p className="text-sm text-ink-muted">{t(($) => $.intro)}</p>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label={t(($) => $.kind)}
          value={kind}
          onChange={(e) => {
            setKind(e.target.value as ImportKind);
            reset();
            if (fileInput.current) fileInput.current.value = '';
          }}
        >
          {importKinds.map((k) => (
            <option key={k} value={k}>
              {t(($) => $.kinds[k])}
            </option>
          ))}
        </SelectField>
        <div className="space-y-1">
          <label htmlFor="import-file" className="block text-sm font-medium">
            {t(($) => $.file)}
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
      {parseProgress !== null && !parsed ? <Progress label={t(($) => $.reading)} fraction={parseProgress} /> : null}
      {message ? <Alert tone={message.tone}>{message.text}</Alert> : null}
      {parsed ? (
        <div className="space-y-4">
          <p className="text-sm">
            <strong>{parsed.fileName}</strong>:{' '}
            {parsed.encoding !== 'utf-8'
              ? t(($) => $.summaryLatin1, { count: parsed.rows.length, rows: formatNumber(parsed.rows.length, 0), columns: formatNumber(parsed.headers.length, 0) })
              : t(($) => $.summary, { count: parsed.rows.length, rows: formatNumber(parsed.rows.length, 0), columns: formatNumber(parsed.headers.length, 0) })}
          </p>
          {parsed.warnings.map((w) => (
            <Alert key={w} tone="warning">
              {warningText(t, w)}
            </Alert>
          ))}
          <fieldset className="grid gap-3 sm:grid-cols-3">
            <legend className="mb-2 text-base font-semibold">{t(($) => $.mapping)}</legend>
            {fields.map((f) => (
              <div key={f.key} className="space-y-1">
                <SelectField
                  label={`${fieldLabel(t, f.key, f.label)}${f.required ? ' *' : ''}`}
                  value={mapping[f.key] === undefined ? '' : String(mapping[f.key])}
                  onChange={(e) => setMapping((m) => ({ ...m, [f.key]: e.target.value === '' ? undefined : Number(e.target.value) }))}
                >
                  <option value="">{t(($) => $.notInFile)}</option>
                  {parsed.headers.map((h, i) => (
                    <option key={i} value={i}>
                      {h || t(($) => $.columnN, { n: i + 1 })}
                    </option>
                  ))}
                </SelectField>
                {f.quantity && mapping[f.key] !== undefined ? (
                  <SelectField
                    label={t(($) => $.unitOf, { field: f.key in lowerKeys ? t(($) => $.fieldsLower[f.key as LowerKey]) : f.label.toLowerCase() })}
                    value={units[f.key] ?? 'metric'}
                    onChange={(e) => setUnits((u) => ({ ...u, [f.key]: e.target.value as 'metric' | 'us' }))}
                  >
                    <option value="metric">
                      {f.quantity === 'volume' ? t(($) => $.units.litres) : f.quantity === 'mass' ? t(($) => $.units.kilograms) : f.quantity === 'temperature' ? '°C' : t(($) => $.units.mm)}
                    </option>
                    <option value="us">
                      {f.quantity === 'volume' ? t(($) => $.units.usGallons) : f.quantity === 'mass' ? t(($) => $.units.pounds) : f.quantity === 'temperature' ? '°F' : t(($) => $.units.inches)}
                    </option>
                  </SelectField>
                ) : null}
              </div>
            ))}
          </fieldset>
          {detection ? (
            detection.candidates.length === 0 ? (
              <Alert tone="error">{t(($) => $.noDateFormat, { column: parsed.headers[mapping[dateField.key]!] ?? '' })}</Alert>
            ) : (
              <SelectField
                label={t(($) => $.dateFormat)}
                value={dateFormat}
                hint={detection.ambiguous ? t(($) => $.ambiguous) : t(($) => $.detected, { format: t(($) => $.dateFormats[detection.format!]) })}
                onChange={(e) => setDateFormat(e.target.value as DateFormat)}
              >
                <option value="">{t(($) => $.choose)}</option>
                {detection.candidates.map((f) => (
                  <option key={f} value={f}>
                    {t(($) => $.dateFormats[f])}
                  </option>
                ))}
              </SelectField>
            )
          ) : null}
          {detection && detection.candidates.length > 0 && dateField.type === 'datetime' ? <p className="text-sm text-ink-muted">{t(($) => $.gardenClock, { zone: timeZone })}</p> : null}
          {normalised ? (
            <>
              {normalised.errors.length ? (
                <ErrorList errors={normalised.errors.slice(0, 300)} total={normalised.errors.length} />
              ) : (
                <Alert tone="success">{t(($) => $.allReady, { count: normalised.records.length, rows: formatNumber(normalised.records.length, 0) })}</Alert>
              )}
              <div className="relative overflow-x-auto">
                <table className="w-full text-sm">
                  <caption className="text-left font-semibold">{t(($) => $.preview)}</caption>
                  <thead className="bg-sand-100 text-left">
                    <tr>
                      <th scope="col" className="px-2 py-1">
                        {t(($) => $.line)}
                      </th>
                      {fields.filter((f) => mapping[f.key] !== undefined).map((f) => (
                        <th key={f.key} scope="col" className="px-2 py-1">
                          {fieldLabel(t, f.key, f.label)}
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
                            {previewCell(tl, f, r[f.key])}
                          </td>
                        ))}
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </>
          ) : null}
          {sendProgress !== null ? <Progress label={t(($) => $.sending)} fraction={sendProgress} /> : null}
          {serverErrors ? <ErrorList errors={serverErrors.rows} total={serverErrors.total} /> : null}
          {result ? (
            <Alert tone="success">
              {result.alreadyImported && !result.inserted
                ? t(($) => $.allAlreadyImported, { count: result.alreadyImported, n: formatNumber(result.alreadyImported, 0) })
                : result.alreadyImported
                  ? t(($) => $.importedSkipped, { count: result.inserted, n: formatNumber(result.inserted, 0), skipped: formatNumber(result.alreadyImported, 0) })
                  : t(($) => $.imported, { count: result.inserted, n: formatNumber(result.inserted, 0) })}
            </Alert>
          ) : null}
          <Button onClick={() => void send()} disabled={!normalised || normalised.errors.length > 0 || normalised.records.length === 0 || sendProgress !== null}>
            {normalised?.records.length ? t(($) => $.importRows, { count: normalised.records.length, n: formatNumber(normalised.records.length, 0) }) : t(($) => $.importNone)}
          </Button>
        </div>
      ) : null}
    </section>
  );
}
