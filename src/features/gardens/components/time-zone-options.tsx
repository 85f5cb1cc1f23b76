import { useMemo } from 'react';
import { useTranslation } from 'react-i18next';
import { offsetMinutesAt, timeZoneNames } from '@shared/time-zone';
import type en from '@/locales/en/gardens.json';

type Region = keyof (typeof en)['timeZone']['regions'];
const regions: readonly Region[] = ['Africa', 'America', 'Antarctica', 'Arctic', 'Asia', 'Atlantic', 'Australia', 'Europe', 'Indian', 'Pacific', 'other'];

/** The browser's own zone, the create form's default; UTC when the browser names none this list knows. */
export function browserTimeZone(): string {
  const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
  return zone && timeZoneNames().includes(zone) ? zone : 'UTC';
}

/** "UTC−07:00" (a real minus sign), the zone's offset now. */
export function formatOffset(minutes: number): string {
  const sign = minutes < 0 ? '−' : '+';
  const a = Math.abs(minutes);
  return `UTC${sign}${String(Math.floor(a / 60)).padStart(2, '0')}:${String(a % 60).padStart(2, '0')}`;
}

/**
 * The `<option>`s of the time-zone select, grouped by the IANA name's first part (America, Europe…),
 * each "Denver (UTC−07:00)" with today's offset. `current` is kept as a choice even if this browser
 * does not list it (a name another browser or the server spelled).
 */
export function TimeZoneOptions({ current }: { current?: string }) {
  const { t } = useTranslation('gardens');
  const groups = useMemo(() => {
    const now = Date.now();
    const names = timeZoneNames();
    if (current && !names.includes(current)) names.push(current);
    const byRegion = new Map<Region, { zone: string; text: string }[]>();
    for (const zone of names.sort()) {
      const slash = zone.indexOf('/');
      const first = slash > 0 ? zone.slice(0, slash) : '';
      const region = (regions as readonly string[]).includes(first) ? (first as Region) : 'other';
      const place = (region === 'other' ? zone : zone.slice(slash + 1)).replaceAll('_', ' ').replaceAll('/', ' / ');
      let offset = '';
      try {
        offset = ` (${formatOffset(offsetMinutesAt(now, zone))})`;
      } catch {
        // A name this browser cannot format: shown without its offset.
      }
      const list = byRegion.get(region) ?? [];
      list.push({ zone, text: `${place}${offset}` });
      byRegion.set(region, list);
    }
    return regions.filter((r) => byRegion.has(r)).map((r) => ({ region: r, zones: byRegion.get(r)! }));
  }, [current]);
  return (
    <>
      {groups.map(({ region, zones }) => (
        <optgroup key={region} label={t(($) => $.timeZone.regions[region])}>
          {zones.map((z) => (
            <option key={z.zone} value={z.zone}>
              {z.text}
            </option>
          ))}
        </optgroup>
      ))}
    </>
  );
}
