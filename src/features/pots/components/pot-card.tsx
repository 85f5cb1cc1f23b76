import { useState, type ReactNode } from 'react';
import { firingBand } from '@shared/agronomy/pyrometric-cones';
import { potMakeLabels, potShapeLabels, type Pot } from '@shared/schemas/pots';
import { Button } from '@/components/ui/button';
import { ConfirmAction } from '@/components/ui/confirm-dialog';
import { formatDay } from './format-day';
import { useUnits } from '@/lib/units';
import { cn } from '@/lib/utils';
import { useDeletePot } from '../api/delete-pot';
import { useUpdatePot } from '../api/update-pot';
import { ConditionBadge } from './condition-badge';
import { digits } from './pot-form-schema';
import { PotForm } from './pot-form';
import { bandLabels, clayBodyLabels, coneDegrees } from './pot-labels';
import { PlacementForm } from './placement-form';
import { SeepTests } from './seep-tests';
import type { PlotChoice, RenderCaution } from './types';

type Panel = 'none' | 'edit' | 'tests' | 'place';

export const cautionAnchors = { twinPotAdhesive: 'caution-twin-pot', openPotMosquitoes: 'caution-open-pots', frost: 'caution-frost' } as const;

function Row({ term, children, numeric }: { term: string; children: ReactNode; numeric?: boolean }) {
  return (
    <div className="flex items-baseline justify-between gap-4 border-b border-sand-100 py-1.5 last:border-b-0">
      <dt className="shrink-0 text-ink-muted">{term}</dt>
      <dd className={cn('min-w-0 text-right', numeric && 'num')}>{children}</dd>
    </div>
  );
}

/** One pot on the shelf: its facts, where it sits, its latest seep rate, and what can be done with it. */
export function PotCard({ pot, plotChoices, renderCaution, onMessage }: { pot: Pot; plotChoices: PlotChoice[]; renderCaution: RenderCaution; onMessage: (m: string) => void }) {
  const units = useUnits();
  const update = useUpdatePot();
  const remove = useDeletePot();
  const [panel, setPanel] = useState<Panel>('none');
  const d = digits(units);
  const small = (cm: number | null) => (cm === null ? '—' : units.fmt(cm * 10, 'length-small', d.small));
  const plot = plotChoices.find((p) => p.id === pot.plotId);
  const twin = pot.make === 'joined_terracotta' || pot.shape === 'twin_pot';
  const open = plot && !plot.lid;
  const latest = pot.seepTests[pot.seepTests.length - 1];
  const titleId = `pot-${pot.id}-title`;
  const panelId = `pot-${pot.id}-panel`;
  const toggle = (p: Panel) => setPanel((cur) => (cur === p ? 'none' : p));

  return (
    <article aria-labelledby={titleId} data-expanded={panel !== 'none'} className={cn('space-y-3 rounded-card border border-sand-200 bg-white p-4 shadow-sm', pot.condition === 'retired' && 'bg-sand-50')}>
      <header className="flex flex-wrap items-start justify-between gap-2">
        <h3 id={titleId} className="min-w-0 break-words">
          {pot.label}
        </h3>
        <ConditionBadge condition={pot.condition} />
      </header>
      <dl className="max-w-2xl text-sm">
        <Row term="Capacity" numeric>
          {units.fmt(pot.capacityL, 'volume', d.volume)}
        </Row>
        <Row term="Size" numeric>
          ⌀ {small(pot.widestDiameterCm)}
          {pot.neckDiameterCm !== null ? `, neck ${small(pot.neckDiameterCm)}` : ''}
          {pot.heightCm !== null ? `, ${small(pot.heightCm)} tall` : ''}
        </Row>
        <Row term="Shape and make">
          {potShapeLabels[pot.shape]} · {potMakeLabels[pot.make]}
        </Row>
        <Row term="Clay">{clayBodyLabels[pot.clayBody]}</Row>
        <Row term="Firing">
          {pot.firingCone ? (
            <>
              Cone {pot.firingCone} · <span className="num">{coneDegrees(pot.firingCone, units.system)}</span> · {bandLabels[firingBand(pot.firingCone)]}
            </>
          ) : (
            'Cone not known'
          )}
        </Row>
        <Row term="Where">
          {pot.plotId ? (
            <>
              Plot {pot.plotLabel}
              {plot ? <span className="text-ink-muted"> · {plot.trialTitle}</span> : null}
            </>
          ) : (
            'On the shelf'
          )}
          {pot.installedOn ? <span className="block text-ink-muted">buried {formatDay(pot.installedOn)}</span> : null}
        </Row>
        <Row term="Latest seep rate" numeric>
          {latest ? (
            <>
              <span className="font-semibold">{units.fmt(pot.latestSeepLitresPerDay, 'rate', d.rate)}</span>
              <span className="block text-ink-muted">{formatDay(latest.testedOn)}</span>
            </>
          ) : (
            <span className="text-ink-muted">not tested yet</span>
          )}
        </Row>
      </dl>
      {pot.notes ? <p className="whitespace-pre-wrap text-sm text-ink-muted">{pot.notes}</p> : null}
      {twin ? (
        <p className="max-w-2xl rounded-lg border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-900">
          Joined with glue or sealant: <a href={`#${cautionAnchors.twinPotAdhesive}`} className="font-medium underline">read the caution on adhesives</a>.
        </p>
      ) : null}
      {open ? (
        <p className="max-w-2xl rounded-lg border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-900">
          Its plot keeps pots without lids: <a href={`#${cautionAnchors.openPotMosquitoes}`} className="font-medium underline">mosquitoes can breed in the open neck</a>.
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" className="min-h-11 aria-expanded:border-terracotta-500 aria-expanded:bg-terracotta-50" aria-expanded={panel === 'tests'} aria-controls={panelId} onClick={() => toggle('tests')}>
          Seep tests ({pot.seepTests.length})
        </Button>
        <Button variant="secondary" className="min-h-11 aria-expanded:border-terracotta-500 aria-expanded:bg-terracotta-50" aria-expanded={panel === 'place'} aria-controls={panelId} onClick={() => toggle('place')}>
          Move or mark
        </Button>
        <Button variant="secondary" className="min-h-11 aria-expanded:border-terracotta-500 aria-expanded:bg-terracotta-50" aria-expanded={panel === 'edit'} aria-controls={panelId} onClick={() => toggle('edit')}>
          Edit
        </Button>
        <ConfirmAction
          label="Delete"
          ariaLabel={`Delete pot ${pot.label}`}
          buttonProps={{ variant: 'ghost', className: 'min-h-11' }}
          title={`Delete ${pot.label}?`}
          confirmLabel="Delete pot and its tests"
          tone="danger"
          onConfirm={() => remove.mutateAsync(pot).then(() => onMessage(`${pot.label} deleted.`))}
        >
          The pot and its {pot.seepTests.length === 1 ? 'seep test are' : `${pot.seepTests.length} seep tests are`} removed from your shelf. Refills already logged in a trial stay in the
          trial. To keep its history, mark it retired instead.
        </ConfirmAction>
      </div>
      {panel !== 'none' ? (
        <div id={panelId}>
          {panel === 'tests' ? <SeepTests pot={pot} /> : null}
          {panel === 'place' ? (
            <PlacementForm
              pot={pot}
              plotChoices={plotChoices}
              renderCaution={renderCaution}
              onDone={(m) => {
                setPanel('none');
                onMessage(m);
              }}
            />
          ) : null}
          {panel === 'edit' ? (
            <div className="rounded-lg border border-sand-200 bg-sand-50 p-3">
              <PotForm
                pot={pot}
                plotChoices={plotChoices}
                renderCaution={renderCaution}
                submitLabel={`Save ${pot.label}`}
                onCancel={() => setPanel('none')}
                onSubmit={(input) =>
                  update.mutateAsync({ pot, changes: input }).then((p) => {
                    setPanel('none');
                    onMessage(`${p.label} saved.`);
                  })
                }
              />
            </div>
          ) : null}
        </div>
      ) : null}
    </article>
  );
}
