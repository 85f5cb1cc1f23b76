import { Fragment, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { formatDateTime } from '@/lib/format';
import { useOutbox } from '../api/get-outbox';

/** Plain text with web addresses made clickable, built from React text nodes (never HTML). */
function TextWithLinks({ text }: { text: string }) {
  const parts: ReactNode[] = [];
  const re = /https?:\/\/[^\s<>"']+/g;
  let last = 0;
  for (const m of text.matchAll(re)) {
    const i = m.index ?? 0;
    if (i > last) parts.push(<Fragment key={`t${last}`}>{text.slice(last, i)}</Fragment>);
    parts.push(
      <a key={`a${i}`} href={m[0]} className="break-all text-terracotta-700 underline" rel="noreferrer noopener">
        {m[0]}
      </a>,
    );
    last = i + m[0].length;
  }
  if (last < text.length) parts.push(<Fragment key={`t${last}`}>{text.slice(last)}</Fragment>);
  return <>{parts}</>;
}

/** E-mails the development mail sink captured, newest first; the text part only. */
export function OutboxList() {
  const { t } = useTranslation('admin');
  const { t: tc } = useTranslation();
  const outbox = useOutbox();
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-ink-muted">
          {outbox.data?.available ? t(($) => $.outbox.count, { count: outbox.data.messages.length }) : ''}
        </p>
        <Button variant="secondary" onClick={() => void outbox.refetch()} disabled={outbox.isFetching}>
          {outbox.isFetching ? tc(($) => $.actions.refreshing) : tc(($) => $.actions.refresh)}
        </Button>
      </div>
      {outbox.isPending ? (
        <p role="status" className="text-ink-muted">
          {t(($) => $.outbox.loading)}
        </p>
      ) : outbox.isError ? (
        <Alert tone="error">{t(($) => $.outbox.loadFailed, { message: outbox.error.message })}</Alert>
      ) : !outbox.data.available ? (
        <Alert tone="info">{t(($) => $.outbox.unavailable)}</Alert>
      ) : outbox.data.messages.length === 0 ? (
        <p className="text-ink-muted">{t(($) => $.outbox.empty)}</p>
      ) : (
        <ul className="space-y-2" aria-label={t(($) => $.outbox.label)}>
          {outbox.data.messages.map((m) => (
            <li key={m.id}>
              <details className="group rounded-card border border-sand-200 bg-white open:shadow-sm">
                <summary className="flex min-h-14 cursor-pointer list-none items-start gap-3 px-4 py-3 hover:bg-sand-50 [&::-webkit-details-marker]:hidden">
                  <span aria-hidden="true" className="mt-0.5 text-ink-muted transition-transform group-open:rotate-90">
                    ▸
                  </span>
                  <span className="min-w-0 flex-1 sm:flex sm:items-center sm:gap-4">
                    <span className="block font-medium sm:flex-1">{m.subject || t(($) => $.outbox.noSubject)}</span>
                    <span className="block text-sm text-ink-muted [overflow-wrap:anywhere]">{t(($) => $.outbox.to, { to: m.to.join(', ') })}</span>
                    <time dateTime={m.receivedAt} className="block shrink-0 text-sm text-ink-muted">
                      {formatDateTime(m.receivedAt)}
                    </time>
                  </span>
                </summary>
                <div className="border-t border-sand-200 px-4 py-3">
                  <p className="mb-2 text-sm text-ink-muted">{t(($) => $.outbox.from, { from: m.from })}</p>
                  <pre className="whitespace-pre-wrap break-words font-sans text-sm text-ink">
                    <TextWithLinks text={m.text} />
                  </pre>
                </div>
              </details>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
