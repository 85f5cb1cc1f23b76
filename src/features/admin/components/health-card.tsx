import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { formatDateTime } from '@/lib/format';
import { useHealth } from '../api/get-health';

function uptime(s: number): string {
  const d = Math.floor(s / 86400);
  const h = Math.floor((s % 86400) / 3600);
  const m = Math.floor((s % 3600) / 60);
  if (d > 0) return `${d} d ${h} h`;
  if (h > 0) return `${h} h ${m} min`;
  return m > 0 ? `${m} min` : `${s} s`;
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
  const health = useHealth();
  return (
    <Card role="region" aria-labelledby="health-heading" className="space-y-3">
      <div className="flex items-center justify-between gap-3">
        <h2 id="health-heading">Health</h2>
        <Button variant="secondary" onClick={() => void health.refetch()} disabled={health.isFetching}>
          {health.isFetching ? 'Checking…' : 'Check again'}
        </Button>
      </div>
      {health.isPending ? (
        <p role="status" className="text-ink-muted">
          Checking…
        </p>
      ) : health.isError ? (
        <Alert tone="error">The health check failed: {health.error.message}</Alert>
      ) : (
        <>
          <p className="flex items-center gap-2 font-medium">
            <span aria-hidden="true" className={`inline-block size-3 rounded-full ${health.data.database.status === 'up' ? 'bg-sage-500' : 'bg-red-700'}`} />
            Database {health.data.database.status === 'up' ? 'is up' : health.data.database.status}, answered in {health.data.database.latencyMs} ms
          </p>
          {/* One <dl> of <div>-wrapped pairs (a <dl> allows no deeper nesting); two columns by CSS. */}
          <dl className="gap-x-8 sm:columns-2">
            <Fact label="Accounts" value={String(health.data.counts.users)} />
            <Fact label="Cohorts" value={String(health.data.counts.cohorts)} />
            <Fact label="Active sessions" value={String(health.data.counts.activeSessions)} />
            <Fact label="Migrations applied" value={String(health.data.database.migrationsApplied)} />
            <Fact label="Database" value={health.data.database.version} />
            <Fact label="Server up for" value={uptime(health.data.process.uptimeS)} />
            <Fact label="Memory (resident / heap)" value={`${health.data.process.rssMb} / ${health.data.process.heapUsedMb} MB`} />
            <Fact label="Node" value={health.data.process.node} />
            <Fact label="Mail" value={health.data.mail.mode} />
          </dl>
          <p className="text-xs text-ink-muted">Checked {formatDateTime(new Date(health.dataUpdatedAt).toISOString())}</p>
        </>
      )}
    </Card>
  );
}
