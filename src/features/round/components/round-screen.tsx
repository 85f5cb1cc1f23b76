import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { useTranslation } from 'react-i18next';
import type { TFunction } from 'i18next';
import { moistureRanges, type MoistureMethod, type RoundInput } from '@shared/schemas/logs';
import { onStepper, suggestTopUp, type TopUpSuggestion } from '@shared/agronomy/refill-forecast';
import { calendarDaysBetween, dayInTimeZone } from '@shared/time-zone';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { formatNumber } from '@/lib/format';
import { parseDecimal } from '@/lib/parse-number';
import { useUnits } from '@/lib/units';
import { cn } from '@/lib/utils';
import { useRound, type RoundPot } from '../api/get-round';
import { useRoundSendState } from '../api/round-outbox';
import { useSaveRound } from '../api/save-round';

/** `at` / `on`: when an entry was first logged, kept if a refused save puts it back on the screen. */
type Entry =
  | { kind: 'refill'; potId: string; plotId: string; volume: number; at?: string }
  | { kind: 'surface'; plotId: string; volume: number; at?: string }
  | { kind: 'moisture'; plotId: string; method: MoistureMethod; depthCm: number; value: number; at?: string }
  | { kind: 'harvest'; plotId: string; freshKg: number; count: number | null; on?: string };
type WaterEntry = Extract<Entry, { kind: 'refill' | 'surface' }>;

function newKey(): string {
  return typeof crypto !== 'undefined' && 'randomUUID' in crypto ? crypto.randomUUID() : `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 12)}`;
}

/** The taps of a walk as one Round request; every entry gets its idempotency key here, once. */
function toInput(entries: Entry[], now: string, timeZone: string): RoundInput {
  // A harvest without a day is the garden's today (its time zone), not the UTC date.
  const today = dayInTimeZone(now, timeZone);
  return {
    entries: entries.map((en): RoundInput['entries'][number] => {
      switch (en.kind) {
        case 'refill':
          return { type: 'water', entry: { plotId: en.plotId, potId: en.potId, occurredAt: en.at ?? now, kind: 'olla_refill', volumeL: en.volume, source: 'mains', fertiliser: false, notes: '', idempotencyKey: newKey() } };
        case 'surface':
          return { type: 'water', entry: { plotId: en.plotId, potId: null, occurredAt: en.at ?? now, kind: 'surface', volumeL: en.volume, source: 'mains', fertiliser: false, notes: '', idempotencyKey: newKey() } };
        case 'moisture':
          return { type: 'moisture', entry: { plotId: en.plotId, takenAt: en.at ?? now, method: en.method, depthCm: en.depthCm, value: en.value, idempotencyKey: newKey() } };
        case 'harvest':
          return { type: 'harvest', entry: { plotId: en.plotId, harvestedOn: en.on ?? today, freshKg: en.freshKg, count: en.count, marketableKg: null, notes: '', idempotencyKey: newKey() } };
      }
    }),
  };
}

/** A refused request back as taps, each with the time it was logged. */
function fromInput(input: RoundInput): Record<string, Entry> {
  const out: Record<string, Entry> = {};
  for (const e of input.entries) {
    if (e.type === 'water' && e.entry.kind === 'olla_refill' && e.entry.potId) {
      out[`pot:${e.entry.potId}`] = { kind: 'refill', potId: e.entry.potId, plotId: e.entry.plotId, volume: e.entry.volumeL, at: e.entry.occurredAt };
    } else if (e.type === 'water') {
      out[`plot:${e.entry.plotId}`] = { kind: 'surface', plotId: e.entry.plotId, volume: e.entry.volumeL, at: e.entry.occurredAt };
    } else if (e.type === 'moisture') {
      out[`moisture:${e.entry.plotId}:${e.entry.idempotencyKey ?? newKey()}`] = { kind: 'moisture', plotId: e.entry.plotId, method: e.entry.method, depthCm: e.entry.depthCm, value: e.entry.value, at: e.entry.takenAt };
    } else {
      out[`harvest:${e.entry.plotId}:${e.entry.idempotencyKey ?? newKey()}`] = { kind: 'harvest', plotId: e.entry.plotId, freshKg: e.entry.freshKg, count: e.entry.count, on: e.entry.harvestedOn };
    }
  }
  return out;
}

/** "last refilled 2 days ago": calendar days in the garden's time zone, not 24-hour periods. */
function daysAgo(iso: string | null, now: number, timeZone: string, t: TFunction<'round'>): string {
  if (!iso) return t(($) => $.never);
  const d = calendarDaysBetween(iso, now, timeZone);
  return d <= 0 ? t(($) => $.today) : d === 1 ? t(($) => $.yesterday) : t(($) => $.daysAgo, { count: d });
}

const potConditions = ['sound', 'cracked', 'clogged', 'retired'] as const;

/** What to pour into a pot now: what it takes to fill it by its seep test, else the last refill, else a full pot. */
function topUp(p: RoundPot, now: number): TopUpSuggestion {
  return suggestTopUp({ capacityL: p.capacityL, seepLPerDay: p.seepLPerDay, lastRefill: p.lastRefillAt && p.lastRefillL !== null ? { at: p.lastRefillAt, volumeL: p.lastRefillL } : null, now });
}

/**
 * The Round: the phone screen for the daily walk. Every pot and surface plot of the trial in one
 * list; one tap marks a refill at the last volume (or a full pot), a second tap saves the walk.
 */
export function RoundScreen({ trialId, title, timeZone, focusPotId }: { trialId: string; title: string; timeZone: string; focusPotId?: string | null }) {
  const units = useUnits();
  const { t } = useTranslation('round');
  const records = (n: number) => t(($) => $.records, { count: n });
  const conditionText = (c: string) => {
    const known = potConditions.find((x) => x === c);
    return known ? t(($) => $.conditions[known]) : c;
  };
  const round = useRound(trialId);
  const save = useSaveRound(trialId);
  const [entries, setEntries] = useState<Record<string, Entry>>({});
  // A refused save: its entries come back (taps made since then win), with the server's reason.
  const [refusal, setRefusal] = useState<{ message: string; keys: string[] } | null>(null);
  const onRefused = useCallback((input: RoundInput, message: string) => {
    const back = fromInput(input);
    setEntries((e) => ({ ...back, ...e }));
    setRefusal((r) => ({ message, keys: [...(r?.keys ?? []), ...Object.keys(back)] }));
  }, []);
  const sending = useRoundSendState(trialId, onRefused);
  const step = units.system === 'us' ? 0.25 : 0.5;

  // Each pot with what to pour now. A seep-test estimate is rounded to the stepper's step (what
  // the − and + buttons would make of it, at least one step, at most the pot's capacity); a last
  // refill or a full pot is a real volume and is kept as it is.
  const pots = useMemo(() => {
    const now = Date.now();
    const list = (round.data?.pots ?? []).map((pot) => {
      const suggestion = topUp(pot, now);
      const fill = suggestion.basis === 'seep-test' ? onStepper(units.show(suggestion.topUpL, 'volume'), step, units.show(pot.capacityL, 'volume')) : null;
      return { pot, suggestion, fill, volume: fill === null ? suggestion.topUpL : units.toSI(Math.max(step, fill), 'volume') };
    });
    // Emptiest first by the seep-test estimate; a pot without one counts as full.
    const share = (x: (typeof list)[number]) => (x.suggestion.levelL ?? x.pot.capacityL) / x.pot.capacityL;
    return list.sort((a, b) => share(a) - share(b));
  }, [round.data, units, step]);
  const surfacePlots = (round.data?.plots ?? []).filter((p) => p.treatment !== 'olla');

  // Opened from a reminder's "logged it" link: that pot is already marked; one tap on Save records it.
  // Once per link: the refetch after the save must not mark it again.
  const preMarked = useRef<string | null>(null);
  useEffect(() => {
    const focus = focusPotId && preMarked.current !== focusPotId ? pots.find((x) => x.pot.id === focusPotId) : undefined;
    if (!focus) return;
    preMarked.current = focusPotId ?? null;
    const { pot, volume } = focus;
    setEntries((e) => (e[`pot:${pot.id}`] ? e : { ...e, [`pot:${pot.id}`]: { kind: 'refill', potId: pot.id, plotId: pot.plotId, volume } }));
  }, [focusPotId, pots]);
  const plotLabel = (id: string) => round.data?.plots.find((p) => p.id === id)?.label ?? '';

  if (round.isPending) return <p role="status">{t(($) => $.loading)}</p>;
  if (round.isError) return <Alert tone="error">{round.error.message}</Alert>;

  const toggle = (key: string, entry: Entry) =>
    setEntries((e) => {
      const next = { ...e };
      if (next[key]) delete next[key];
      else next[key] = entry;
      return next;
    });
  const adjust = (key: string, delta: number) =>
    setEntries((e) => {
      const cur = e[key];
      if (!cur || (cur.kind !== 'refill' && cur.kind !== 'surface')) return e;
      const display = Math.max(step, Math.round((units.show(cur.volume, 'volume') + delta) / step) * step);
      return { ...e, [key]: { ...cur, volume: units.toSI(display, 'volume') } };
    });

  const count = Object.keys(entries).length;
  const now = Date.now();
  /** The line under a pot: where its suggested volume comes from. */
  const suggestionNote = (suggestion: TopUpSuggestion, fill: number | null) => {
    if (fill === null) return suggestion.basis === 'last-refill' ? t(($) => $.suggestion.lastRefill) : t(($) => $.suggestion.fullPot);
    if (fill === 0) return t(($) => $.suggestion.stillFull);
    return t(($) => $.suggestion.toFill, { volume: `${formatNumber(fill, 2)} ${units.label('volume')}` });
  };
  // The walk goes to the queue at once: sent now with a connection, kept on the phone without one.
  const submit = () => {
    const input = toInput(Object.values(entries), new Date().toISOString(), timeZone);
    setRefusal(null);
    setEntries({});
    sending.clearRefused();
    save.mutate({ trialId, input });
  };

  const row = (key: string, entry: WaterEntry, heading: string, sub: string, level: number | null, capacity: number | null, note: string | null = null) => {
    const on = Boolean(entries[key]);
    const current = entries[key];
    const vol = current && (current.kind === 'refill' || current.kind === 'surface') ? current.volume : entry.volume;
    return (
      <li key={key} className={cn('rounded-card border bg-white p-3', on ? 'border-terracotta-400 ring-2 ring-terracotta-200' : 'border-sand-200')}>
        <div className="flex items-center gap-3">
          <div className="min-w-0 flex-1">
            <p className="font-semibold">{heading}</p>
            <p className="text-sm text-ink-muted">
              {sub}
              {sending.waitingFor.has(key) ? <span className="font-medium text-terracotta-700">{t(($) => $.waitingToSend)}</span> : null}
            </p>
            {level !== null && capacity ? (
              <div className="mt-1 flex items-center gap-2" aria-label={t(($) => $.estimatedFull, { pct: formatNumber((level / capacity) * 100, 0) })}>
                <div className="h-2 w-24 overflow-hidden rounded bg-sand-200">
                  <div className={cn('h-full', level / capacity < 0.25 ? 'bg-terracotta-600' : 'bg-sage-500')} style={{ width: `${(level / capacity) * 100}%` }} />
                </div>
                <span className="text-xs text-ink-muted">{t(($) => $.left, { pct: formatNumber((level / capacity) * 100, 0) })}</span>
              </div>
            ) : null}
            {note ? <p className="mt-1 text-xs text-ink-muted">{note}</p> : null}
          </div>
          <Button
            size="lg"
            variant={on ? 'primary' : 'secondary'}
            className="min-w-36"
            aria-pressed={on}
            onClick={() => toggle(key, { ...entry, volume: vol })}
          >
            {on ? '✓ ' : ''}
            {units.fmt(vol, 'volume', 2)}
          </Button>
        </div>
        {on ? (
          <div className="mt-2 flex items-center justify-end gap-2">
            <Button size="md" variant="secondary" aria-label={t(($) => $.lessWater, { name: heading })} onClick={() => adjust(key, -step)}>
              −
            </Button>
            <Button size="md" variant="secondary" aria-label={t(($) => $.moreWater, { name: heading })} onClick={() => adjust(key, step)}>
              +
            </Button>
          </div>
        ) : null}
      </li>
    );
  };

  return (
    <div className="mx-auto max-w-xl space-y-5 pb-28">
      <div>
        <p className="text-sm text-ink-muted">{t(($) => $.todaysRound)}</p>
        <h1>{title}</h1>
        <p className="text-sm text-ink-muted">{t(($) => $.intro)}</p>
      </div>
      {refusal ? (
        <Alert tone="error">
          {t(($) => $.refused, { message: refusal.message || t(($) => $.refusedDefault) })}{' '}
          <button
            type="button"
            className="font-medium underline"
            onClick={() => {
              sending.clearRefused();
              setEntries((e) => Object.fromEntries(Object.entries(e).filter(([k]) => !refusal.keys.includes(k))));
              setRefusal(null);
            }}
          >
            {t(($) => $.discard)}
          </button>
        </Alert>
      ) : null}
      {sending.waiting > 0 && sending.queued ? (
        <Alert tone="warning">
          <strong>{t(($) => $.savedOnPhone, { count: sending.waiting })}</strong>
          <span className="block">{t(($) => $.sentByThemselves)}</span>
        </Alert>
      ) : sending.waiting > 0 ? (
        <Alert tone="info">{t(($) => $.sending, { records: records(sending.waiting) })}</Alert>
      ) : sending.sent ? (
        <Alert tone="success">{sending.sent.waited ? t(($) => $.sentAfterWait, { records: records(sending.sent.n) }) : t(($) => $.saved, { records: records(sending.sent.n) })}</Alert>
      ) : null}
      <section aria-labelledby="pots-heading" className="space-y-2">
        <h2 id="pots-heading" className="text-lg">
          {t(($) => $.pots, { count: pots.length })}
        </h2>
        {pots.length === 0 ? <p className="text-ink-muted">{t(($) => $.noPots)}</p> : null}
        <ul className="space-y-2">
          {pots.map(({ pot: p, suggestion, fill, volume }) =>
            row(
              `pot:${p.id}`,
              { kind: 'refill', potId: p.id, plotId: p.plotId, volume },
              t(($) => $.potHeading, { pot: p.label, plot: plotLabel(p.plotId) }),
              `${t(($) => $.potSub, { capacity: units.fmt(p.capacityL, 'volume', 1), ago: daysAgo(p.lastRefillAt, now, timeZone, t) })}${p.condition !== 'sound' ? ` · ${conditionText(p.condition)}` : ''}`,
              suggestion.levelL,
              p.capacityL,
              suggestionNote(suggestion, fill),
            ),
          )}
        </ul>
      </section>
      <section aria-labelledby="surface-heading" className="space-y-2">
        <h2 id="surface-heading" className="text-lg">
          {t(($) => $.surfacePlots, { count: surfacePlots.length })}
        </h2>
        <ul className="space-y-2">
          {surfacePlots.map((p) =>
            row(
              `plot:${p.id}`,
              { kind: 'surface', plotId: p.id, volume: p.lastSurfaceL ?? 10 },
              t(($) => $.plotHeading, { plot: p.label }),
              t(($) => $.plotSub, { area: units.fmt(p.areaM2, 'area', 1), ago: daysAgo(p.lastWateredAt, now, timeZone, t) }),
              null,
              null,
            ),
          )}
        </ul>
      </section>
      <ExtraEntries
        plots={round.data?.plots ?? []}
        massLabel={units.label('mass')}
        onAdd={(key, entry) => setEntries((e) => ({ ...e, [key]: entry }))}
        toKg={(v) => units.toSI(v, 'mass')}
        pending={Object.entries(entries).filter(([, e]) => e.kind === 'moisture' || e.kind === 'harvest')}
        onRemove={(key) =>
          setEntries((e) => {
            const next = { ...e };
            delete next[key];
            return next;
          })
        }
      />
      <div className="fixed inset-x-0 bottom-0 border-t border-sand-200 bg-white/95 p-3 backdrop-blur">
        <div className="mx-auto max-w-xl">
          <Button size="lg" className="w-full" disabled={count === 0} onClick={submit}>
            {count === 0 ? t(($) => $.tapWhat) : t(($) => $.save, { records: records(count) })}
          </Button>
        </div>
      </div>
    </div>
  );
}

/** A moisture reading or a pick, added to the same walk and saved with it. */
function ExtraEntries({
  plots,
  massLabel,
  toKg,
  onAdd,
  pending,
  onRemove,
}: {
  plots: { id: string; label: string }[];
  massLabel: string;
  toKg: (v: number) => number;
  onAdd: (key: string, entry: Entry) => void;
  pending: [string, Entry][];
  onRemove: (key: string) => void;
}) {
  const [plotId, setPlotId] = useState(plots[0]?.id ?? '');
  const [method, setMethod] = useState<MoistureMethod>('vwc');
  const [reading, setReading] = useState('');
  const [mass, setMass] = useState('');
  const [count, setCount] = useState('');
  const [error, setError] = useState<string | null>(null);
  const { t } = useTranslation('round');
  const label = (id: string) => plots.find((p) => p.id === id)?.label ?? '';
  const range = moistureRanges[method];
  const addReading = () => {
    const v = parseDecimal(reading);
    if (!Number.isFinite(v) || v < range.min || v > range.max)
      return setError(t(($) => $.extra.rangeError[method], { min: formatNumber(range.min, 0), max: formatNumber(range.max, 0) }));
    setError(null);
    onAdd(`moisture:${plotId}:${Date.now()}`, { kind: 'moisture', plotId, method, depthCm: 15, value: v });
    setReading('');
  };
  const addHarvest = () => {
    const v = parseDecimal(mass);
    if (!Number.isFinite(v) || v <= 0) return setError(t(($) => $.extra.enterMass));
    const c = count.trim() === '' ? null : parseDecimal(count);
    if (c !== null && (!Number.isInteger(c) || c < 0)) return setError(t(($) => $.extra.wholeCount));
    setError(null);
    onAdd(`harvest:${plotId}:${Date.now()}`, { kind: 'harvest', plotId, freshKg: toKg(v), count: c });
    setMass('');
    setCount('');
  };
  if (!plots.length) return null;
  const input = 'block h-12 w-full rounded-lg border border-sand-300 bg-white px-3 text-base';
  return (
    <section aria-labelledby="extra-heading" className="space-y-3 rounded-card border border-sand-200 bg-white p-3">
      <h2 id="extra-heading" className="text-lg">
        {t(($) => $.extra.title)}
      </h2>
      {error ? <Alert tone="error">{error}</Alert> : null}
      <label className="block text-sm font-medium">
        {t(($) => $.extra.plot)}
        <select className={input} value={plotId} onChange={(e) => setPlotId(e.target.value)}>
          {plots.map((p) => (
            <option key={p.id} value={p.id}>
              {p.label}
            </option>
          ))}
        </select>
      </label>
      <div className="grid grid-cols-2 gap-2">
        <label className="block text-sm font-medium">
          {t(($) => $.extra.method)}
          <select className={input} value={method} onChange={(e) => setMethod(e.target.value as MoistureMethod)}>
            {(['vwc', 'tensiometer', 'probe_index'] as const).map((m) => (
              <option key={m} value={m}>
                {t(($) => $.extra.methods[m])}
              </option>
            ))}
          </select>
        </label>
        <label className="block text-sm font-medium">
          {t(($) => $.extra.reading, { unit: range.unit === 'index' ? '1–10' : range.unit })}
          <input className={input} inputMode="decimal" value={reading} onChange={(e) => setReading(e.target.value)} />
        </label>
      </div>
      <Button variant="secondary" className="w-full" size="lg" onClick={addReading}>
        {t(($) => $.extra.addReading)}
      </Button>
      <div className="grid grid-cols-2 gap-2">
        <label className="block text-sm font-medium">
          {t(($) => $.extra.picked, { unit: massLabel })}
          <input className={input} inputMode="decimal" value={mass} onChange={(e) => setMass(e.target.value)} />
        </label>
        <label className="block text-sm font-medium">
          {t(($) => $.extra.fruits)}
          <input className={input} inputMode="numeric" value={count} onChange={(e) => setCount(e.target.value)} />
        </label>
      </div>
      <Button variant="secondary" className="w-full" size="lg" onClick={addHarvest}>
        {t(($) => $.extra.addPick)}
      </Button>
      {pending.length ? (
        <ul className="space-y-1 text-sm">
          {pending.map(([key, e]) => (
            <li key={key} className="flex items-center gap-2">
              <span>
                {e.kind === 'moisture'
                  ? t(($) => $.extra.readingOn, { value: formatNumber(e.value, 2), plot: label(e.plotId) })
                  : e.kind === 'harvest'
                    ? t(($) => $.extra.pickOn, { plot: label(e.plotId) })
                    : ''}
              </span>
              <Button variant="ghost" size="sm" className="ml-auto" onClick={() => onRemove(key)}>
                {t(($) => $.extra.remove)}
              </Button>
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
