import { useTranslation } from 'react-i18next';
import { cn } from '@/lib/utils';
import { useIsOnline } from '../online';
import { useOutboxSummary } from '../outbox';

/**
 * The connection and the outbox in a few words: "Offline · 3 waiting to send". Nothing when
 * online with nothing waiting. A small pill that fits in a header.
 */
export function PendingSendBadge({ className }: { className?: string }) {
  // Not suspending: the bar sits above the router, and its words are not worth holding up every page.
  const { t, ready } = useTranslation('offline', { useSuspense: false });
  const online = useIsOnline();
  const { waiting, refused } = useOutboxSummary();
  if (!ready || (online && waiting === 0 && refused === 0)) return null;
  const parts: string[] = [];
  if (!online) parts.push(t(($) => $.offline));
  if (waiting > 0) parts.push(online ? t(($) => $.sending, { count: waiting }) : t(($) => $.waiting, { count: waiting }));
  if (refused > 0) parts.push(t(($) => $.refused, { count: refused }));
  return (
    <span
      role="status"
      aria-label={parts.join(' · ')}
      className={cn(
        'inline-flex items-center gap-1.5 rounded-full border px-3 py-1 text-sm font-medium',
        refused > 0 ? 'border-red-300 bg-red-50 text-red-900' : online ? 'border-sage-200 bg-sage-50 text-sage-800' : 'border-terracotta-200 bg-terracotta-50 text-terracotta-800',
        className,
      )}
    >
      <span aria-hidden className={cn('inline-block h-2 w-2 rounded-full', online ? 'bg-sage-500' : 'bg-terracotta-500')} />
      {parts.join(' · ')}
    </span>
  );
}

/**
 * A slim bar above every page carrying the badge. The app shell's header is another feature's
 * file; dropping <PendingSendBadge /> into it and removing this bar from app.tsx moves the badge
 * into the header.
 */
export function OfflineBar() {
  return (
    <div className="flex justify-center border-b border-sand-200 bg-sand-50 px-4 py-1.5 empty:hidden">
      <PendingSendBadge />
    </div>
  );
}
