import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { useNavigate, useParams } from 'react-router-dom';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { paths } from '@/config/paths';
import { useGarden } from '@/features/gardens/api/get-garden';
import { useDeleteGarden, useUpdateGarden } from '@/features/gardens/api/save-garden';
import { GardenForm } from '@/features/gardens/components/garden-form';
import { WeatherPanel } from '@/features/gardens/components/weather-panel';
import { useTrials } from '@/features/trials/api/get-trials';
import { useCreateTrial } from '@/features/trials/api/trial-mutations';
import { TrialCards } from '@/features/trials/components/trial-cards';
import { TrialForm } from '@/features/trials/components/trial-form';
import { formatNumber } from '@/lib/format';
import { useUnits } from '@/lib/units';

export function GardenPage() {
  const { gardenId = '' } = useParams();
  const navigate = useNavigate();
  const units = useUnits();
  const { t } = useTranslation('gardens');
  const { t: tc } = useTranslation('common');
  const garden = useGarden(gardenId);
  const trials = useTrials(gardenId);
  const update = useUpdateGarden(gardenId);
  const remove = useDeleteGarden();
  const createTrial = useCreateTrial(gardenId);
  const [editing, setEditing] = useState(false);
  const [adding, setAdding] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState(false);
  if (garden.isPending) return <p role="status">{t(($) => $.page.loading)}</p>;
  if (garden.isError) return <Alert tone="error">{garden.error.message}</Alert>;
  const g = garden.data;
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-start gap-3">
        <div>
          <h1>{g.name}</h1>
          <p className="text-ink-muted">
            {formatNumber(g.latitudeDeg, 1, 1)}°, {formatNumber(g.longitudeDeg, 1, 1)}° · {units.fmt(g.elevationM, 'length', 0)} · {t(($) => $.soil[g.soilTexture])}
            {g.coastal ? ` · ${t(($) => $.page.coastal)}` : ''}
          </p>
          <p className="text-sm text-ink-muted">{t(($) => $.page.timeZone, { zone: g.timeZone })}</p>
        </div>
        <div className="ml-auto flex gap-2">
          <Button variant="secondary" onClick={() => setEditing((v) => !v)}>
            {editing ? tc(($) => $.actions.cancel) : t(($) => $.page.edit)}
          </Button>
          <Button variant="ghost" onClick={() => setConfirmDelete(true)}>
            {tc(($) => $.actions.delete)}
          </Button>
        </div>
      </div>
      {editing ? <GardenForm garden={g} submitLabel={t(($) => $.page.save)} onSubmit={(input) => update.mutateAsync(input).then(() => setEditing(false))} /> : null}
      <section aria-labelledby="trials-heading" className="space-y-3">
        <div className="flex items-center gap-3">
          <h2 id="trials-heading">{t(($) => $.page.trials)}</h2>
          <Button size="sm" onClick={() => setAdding((v) => !v)}>
            {adding ? tc(($) => $.actions.cancel) : t(($) => $.page.newTrial)}
          </Button>
        </div>
        {adding ? (
          <div className="rounded-card border border-sand-200 bg-white p-4">
            <TrialForm
              timeZone={g.timeZone}
              submitLabel={t(($) => $.page.createTrial)}
              onSubmit={(input) => createTrial.mutateAsync(input).then((created) => navigate(paths.trial(created.id)))}
            />
          </div>
        ) : null}
        {trials.isPending ? <p role="status">{t(($) => $.page.loadingTrials)}</p> : <TrialCards trials={trials.data ?? []} trialPath={paths.trial} roundPath={paths.round} />}
      </section>
      <WeatherPanel gardenId={g.id} timeZone={g.timeZone} />
      <ConfirmDialog
        open={confirmDelete}
        title={t(($) => $.page.deleteTitle, { name: g.name })}
        confirmLabel={t(($) => $.page.deleteConfirm)}
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() => remove.mutate(g.id, { onSuccess: () => navigate(paths.home) })}
      >
        {t(($) => $.page.deleteBody)}
      </ConfirmDialog>
    </div>
  );
}
