import { formatDate } from '@/lib/format';

/**
 * A calendar date (YYYY-MM-DD) in the reader's language, as that very day wherever they are
 * (lib/format reads a bare date in UTC, so no time zone moves it to the day before).
 */
export function formatDay(isoDate: string): string {
  return formatDate(isoDate);
}
