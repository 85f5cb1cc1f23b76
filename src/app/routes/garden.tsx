import { useState } from 'react';
import { useNavigate, useParams } from 'react-router-dom';
import { soilTextureLabels } from '@shared/schemas/gardens';
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
import { useUnits } from '@/lib/units';

export function GardenPage() {
  const { gardenId = '' } = useParams();
  const navigate = useNavigate();
  const units = useUnits();
  const garden = useGarden(gardenId);
  const trials = useTrials(gardenId);
  const update = useUpdateGarden(gardenId);
  const remove = useDeleteGarden();
  const createTrial = useCreateTrial(gardenId);
  const [editing, setEditing] = useState(false);
  const [adding, setAdding] = useState(false);
  const [confirmDelete, setConfirmDelete] = useState(false);
  if (garden.isPending) return <p role="status">Loading the garden…</p>;
  if (garden.isError) return <Alert tone="error">{garden.error.message}</Alert>;
  const g = garden.data;
  return (
    <div className="space-y-8">
      <div className="flex flex-wrap items-start gap-3">
        <div>
          <h1>{g.name}</h1>
          <p className="text-ink-muted">
            {g.latitudeDeg.toFixed(1)}°, {g.longitudeDeg.toFixed(1)}° · {units.fmt(g.elevationM, 'length', 0)} · {soilTextureLabels[g.soilTexture]}
            {g.coastal ? ' · coastal' : ''}
          </p>
        </div>
        <div className="ml-auto flex gap-2">
          <Button variant="secondary" onClick={() => setEditing((v) => !v)}>
            {editing ? 'Cancel' : 'Edit garden'}
          </Button>
          <Button variant="ghost" onClick={() => setConfirmDelete(true)}>
            Delete
          </Button>
        </div>
      </div>
      {editing ? <GardenForm garden={g} submitLabel="Save garden" onSubmit={(input) => update.mutateAsync(input).then(() => setEditing(false))} /> : null}
      <section aria-labelledby="trials-heading" className="space-y-3">
        <div className="flex items-center gap-3">
          <h2 id="trials-heading">Trials</h2>
          <Button size="sm" onClick={() => setAdding((v) => !v)}>
            {adding ? 'Cancel' : 'New trial'}
          </Button>
        </div>
        {adding ? (
          <div className="rounded-card border border-sand-200 bg-white p-4">
            <TrialForm
              submitLabel="Create trial"
              onSubmit={(input) => createTrial.mutateAsync(input).then((t) => navigate(paths.trial(t.id)))}
            />
          </div>
        ) : null}
        {trials.isPending ? <p role="status">Loading trials…</p> : <TrialCards trials={trials.data ?? []} trialPath={paths.trial} roundPath={paths.round} />}
      </section>
      <WeatherPanel gardenId={g.id} />
      <ConfirmDialog
        open={confirmDelete}
        title={`Delete ${g.name}?`}
        confirmLabel="Delete garden and its trials"
        tone="danger"
        pending={remove.isPending}
        error={remove.error?.message ?? null}
        onCancel={() => setConfirmDelete(false)}
        onConfirm={() => remove.mutate(g.id, { onSuccess: () => navigate(paths.home) })}
      >
        Every trial, plot, record and weather day of this garden is deleted. This cannot be undone.
      </ConfirmDialog>
    </div>
  );
}
