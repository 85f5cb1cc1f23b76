import type { TFunction } from 'i18next';
import { useTranslation } from 'react-i18next';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { formatDateTime, formatNumber } from '@/lib/format';
import { useHealth } from '../api/get-health';

function uptime(s: number, t: TFunction<'admin'>): string {
  const d = Math.floor(s / 86400);
  const h = Math.floor((s % 86400) / 3600);
  const m = Math.floor((s % 3600) / 60);
  if (d > 0) return t(($) => $.health.days, { d, h });
  if (h > 0) return t(($) => $.health.hours, { h, m });
  return m > 0 ? t(($) => $.health.minutes, { m }) : t(($) => $.health.seconds, { s: Math.floor(s) });
}

function Fact({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex break-inside-avoid items-baseline justify-between gap-3 border-b border-sand-100 py-1.5">
      <dt className="text-sm text-ink-muted">{label}</dt>
      <dd className="num text-sm font-medium">{value}</dd>
    </div>
  );
}

/** Database, counts, process and mail at a glance, with a manual refresh. */
export function HealthCard() {
  const { t } = useTranslation('admin');
  const health = useHealth();
  return (
    <Card role="region" aria-labelledby="health-heading" className="space-y-3">
      <div className="flex items-center justify-between gap-3">
        <h2 id="health-heading">{t(($) => $.health.title)}</h2>
        <Button variant="secondary" onClick={() => void health.refetch()} disabled={health.isFetching}>
          {health.isFetching ? t(($) => $.health.checking) : t(($) => $.health.check)}
        </Button>
      </div>
      {health.isPending ? (
        <p role="status" className="text-ink-muted">
          {t(($) => $.health.checking)}
        </p>
      ) : health.isError ? (
        <Alert tone="error">{t(($) => $.health.failed, { message: health.error.message })}</Alert>
      ) : (
        <>
          <p className="flex items-center gap-2 font-medium">
            <span aria-hidden="true" className={`inline-block size-3 rounded-full ${health.data.database.status === 'up' ? 'bg-sage-500' : 'bg-red-700'}`} />
            {health.data.database.status === 'up'
              ? t(($) => $.health.dbUp, { ms: formatNumber(health.data.database.latencyMs, 0) })
              : t(($) => $.health.dbState, { ms: formatNumber(health.data.database.latencyMs, 0) })}
          </p>
          {/* One <dl> of <div>-wrapped pairs (a <dl> allows no deeper nesting); two columns by CSS. */}
          <dl className="gap-x-8 sm:columns-2">
            <Fact label={t(($) => $.health.accounts)} value={formatNumber(health.data.counts.users, 0)} />
            <Fact label={t(($) => $.health.cohorts)} value={formatNumber(health.data.counts.cohorts, 0)} />
            <Fact label={t(($) => $.health.sessions)} value={formatNumber(health.data.counts.activeSessions, 0)} />
            <Fact label={t(($) => $.health.migrations)} value={formatNumber(health.data.database.migrationsApplied, 0)} />
            <Fact label={t(($) => $.health.database)} value={health.data.database.version} />
            <Fact label={t(($) => $.health.uptime)} value={uptime(health.data.process.uptimeS, t)} />
            <Fact label={t(($) => $.health.memory)} value={`${formatNumber(health.data.process.rssMb, 0)} / ${formatNumber(health.data.process.heapUsedMb, 0)} MB`} />
            <Fact label={t(($) => $.health.node)} value={health.data.process.node} />
            <Fact label={t(($) => $.health.mail)} value={t(($) => $.health.mailModes[health.data.mail.mode])} />
          </dl>
          <p className="text-xs text-ink-muted">{t(($) => $.health.checked, { when: formatDateTime(new Date(health.dataUpdatedAt).toISOString()) })}</p>
        </>
      )}
    </Card>
  );
}
