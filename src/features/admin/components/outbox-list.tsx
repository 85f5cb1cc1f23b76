import { Fragment, type ReactNode } from 'react';
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
  const outbox = useOutbox();
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p className="text-ink-muted">
          {outbox.data?.available ? `${outbox.data.messages.length} message${outbox.data.messages.length === 1 ? '' : 's'}, newest first.` : ''}
        </p>
        <Button variant="secondary" onClick={() => void outbox.refetch()} disabled={outbox.isFetching}>
          {outbox.isFetching ? 'Refreshing…' : 'Refresh'}
        </Button>
      </div>
      {outbox.isPending ? (
        <p role="status" className="text-ink-muted">
          Loading the outbox…
        </p>
      ) : outbox.isError ? (
        <Alert tone="error">Could not load the outbox: {outbox.error.message}</Alert>
      ) : !outbox.data.available ? (
        <Alert tone="info">{outbox.data.message ?? 'There is no local outbox on this server.'}</Alert>
      ) : outbox.data.messages.length === 0 ? (
        <p className="text-ink-muted">No e-mails yet. Sign-ups, password resets and cohort invitations land here.</p>
      ) : (
        <ul className="space-y-2" aria-label="Captured e-mails">
          {outbox.data.messages.map((m) => (
            <li key={m.id}>
              <details className="group rounded-card border border-sand-200 bg-white open:shadow-sm">
                <summary className="flex min-h-14 cursor-pointer list-none items-start gap-3 px-4 py-3 hover:bg-sand-50 [&::-webkit-details-marker]:hidden">
                  <span aria-hidden="true" className="mt-0.5 text-ink-muted transition-transform group-open:rotate-90">
                    ▸
                  </span>
                  <span className="min-w-0 flex-1 sm:flex sm:items-center sm:gap-4">
                    <span className="block font-medium sm:flex-1">{m.subject || '(no subject)'}</span>
                    <span className="block text-sm text-ink-muted [overflow-wrap:anywhere]">to {m.to.join(', ')}</span>
                    <time dateTime={m.receivedAt} className="block shrink-0 text-sm text-ink-muted">
                      {formatDateTime(m.receivedAt)}
                    </time>
                  </span>
                </summary>
                <div className="border-t border-sand-200 px-4 py-3">
                  <p className="mb-2 text-sm text-ink-muted">From {m.from}</p>
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
