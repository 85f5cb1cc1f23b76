import { useState, type ReactNode } from 'react';
import { useTranslation } from 'react-i18next';
import { firingBand } from '@shared/agronomy/pyrometric-cones';
import type { Pot } from '@shared/schemas/pots';
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
import { coneDegrees } from './pot-labels';
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
  const { t } = useTranslation('pots');
  const { t: tc } = useTranslation('common');
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
        <Row term={t(($) => $.card.capacity)} numeric>
          {units.fmt(pot.capacityL, 'volume', d.volume)}
        </Row>
        <Row term={t(($) => $.card.size)} numeric>
          ⌀ {small(pot.widestDiameterCm)}
          {pot.neckDiameterCm !== null ? t(($) => $.card.neck, { size: small(pot.neckDiameterCm) }) : ''}
          {pot.heightCm !== null ? t(($) => $.card.tall, { size: small(pot.heightCm) }) : ''}
        </Row>
        <Row term={t(($) => $.card.shapeMake)}>
          {t(($) => $.shapes[pot.shape])} · {t(($) => $.makes[pot.make])}
        </Row>
        <Row term={t(($) => $.card.clay)}>{t(($) => $.clays[pot.clayBody])}</Row>
        <Row term={t(($) => $.card.firing)}>
          {pot.firingCone ? (
            <>
              {t(($) => $.card.cone, { cone: pot.firingCone })} · <span className="num">{coneDegrees(pot.firingCone, units.system)}</span> ·{' '}
              {t(($) => $.bands[firingBand(pot.firingCone!)])}
            </>
          ) : (
            t(($) => $.card.coneUnknown)
          )}
        </Row>
        <Row term={t(($) => $.card.where)}>
          {pot.plotId ? (
            <>
              {t(($) => $.card.plot, { plot: pot.plotLabel })}
              {plot ? <span className="text-ink-muted"> · {plot.trialTitle}</span> : null}
            </>
          ) : (
            t(($) => $.card.onShelf)
          )}
          {pot.installedOn ? <span className="block text-ink-muted">{t(($) => $.card.buried, { date: formatDay(pot.installedOn) })}</span> : null}
        </Row>
        <Row term={t(($) => $.card.latestRate)} numeric>
          {latest ? (
            <>
              <span className="font-semibold">{units.fmt(pot.latestSeepLitresPerDay, 'rate', d.rate)}</span>
              <span className="block text-ink-muted">{formatDay(latest.testedOn)}</span>
            </>
          ) : (
            <span className="text-ink-muted">{t(($) => $.card.notTested)}</span>
          )}
        </Row>
      </dl>
      {pot.notes ? <p className="whitespace-pre-wrap text-sm text-ink-muted">{pot.notes}</p> : null}
      {twin ? (
        <p className="max-w-2xl rounded-lg border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-900">
          {t(($) => $.card.glued)}
          <a href={`#${cautionAnchors.twinPotAdhesive}`} className="font-medium underline">
            {t(($) => $.card.gluedLink)}
          </a>
          .
        </p>
      ) : null}
      {open ? (
        <p className="max-w-2xl rounded-lg border border-amber-300 bg-amber-50 px-3 py-2 text-sm text-amber-900">
          {t(($) => $.card.openLids)}
          <a href={`#${cautionAnchors.openPotMosquitoes}`} className="font-medium underline">
            {t(($) => $.card.openLink)}
          </a>
          .
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" className="min-h-11 aria-expanded:border-terracotta-500 aria-expanded:bg-terracotta-50" aria-expanded={panel === 'tests'} aria-controls={panelId} onClick={() => toggle('tests')}>
          {t(($) => $.card.seepTests, { count: pot.seepTests.length })}
        </Button>
        <Button variant="secondary" className="min-h-11 aria-expanded:border-terracotta-500 aria-expanded:bg-terracotta-50" aria-expanded={panel === 'place'} aria-controls={panelId} onClick={() => toggle('place')}>
          {t(($) => $.card.moveOrMark)}
        </Button>
        <Button variant="secondary" className="min-h-11 aria-expanded:border-terracotta-500 aria-expanded:bg-terracotta-50" aria-expanded={panel === 'edit'} aria-controls={panelId} onClick={() => toggle('edit')}>
          {tc(($) => $.actions.edit)}
        </Button>
        <ConfirmAction
          label={tc(($) => $.actions.delete)}
          ariaLabel={t(($) => $.card.deletePot, { pot: pot.label })}
          buttonProps={{ variant: 'ghost', className: 'min-h-11' }}
          title={t(($) => $.card.deleteTitle, { pot: pot.label })}
          confirmLabel={t(($) => $.card.deleteConfirm)}
          tone="danger"
          onConfirm={() => remove.mutateAsync(pot).then(() => onMessage(t(($) => $.card.deleted, { pot: pot.label })))}
        >
          {t(($) => $.card.deleteBody, { count: pot.seepTests.length })}
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
                submitLabel={t(($) => $.card.save, { pot: pot.label })}
                onCancel={() => setPanel('none')}
                onSubmit={(input) =>
                  update.mutateAsync({ pot, changes: input }).then((p) => {
                    setPanel('none');
                    onMessage(t(($) => $.card.saved, { pot: p.label }));
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
