const dayFmt = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric' });

/**
 * A calendar date (YYYY-MM-DD) in the reader's locale, read as that day in their own calendar.
 * (new Date('2026-04-10') is midnight UTC, which west of Greenwich prints as 9 April.)
 */
export function formatDay(isoDate: string): string {
  const [y, m, d] = isoDate.split('-').map(Number);
  if (!y || !m || !d) return isoDate;
  return dayFmt.format(new Date(y, m - 1, d));
}
