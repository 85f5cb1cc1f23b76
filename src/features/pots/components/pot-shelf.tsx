import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { potConditionSchema, type PotCondition } from '@shared/schemas/pots';
import { Alert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/lib/utils';
import { useCreatePot } from '../api/create-pot';
import { usePots } from '../api/get-pots';
import { cautionAnchors, PotCard } from './pot-card';
import { PotForm } from './pot-form';
import type { PlotChoice, RenderCaution } from './types';

type Filter = 'all' | PotCondition;

/**
 * The Pot shelf: every pot with its size, firing, place and latest seep rate; add, edit,
 * move, mark and delete pots; seep tests per pot. Plots come from the route (the trials' data).
 */
export function PotShelf({ plotChoices, plotsError, renderCaution }: { plotChoices: PlotChoice[]; plotsError?: string | null; renderCaution: RenderCaution }) {
  const { t } = useTranslation('pots');
  const pots = usePots();
  const create = useCreatePot();
  const [adding, setAdding] = useState(false);
  const [filter, setFilter] = useState<Filter>('all');
  const [message, setMessage] = useState<string | null>(null);
  const focusAddButton = () => document.getElementById('add-pot-button')?.focus();

  const all = pots.data ?? [];
  const counts = Object.fromEntries(potConditionSchema.options.map((c) => [c, all.filter((p) => p.condition === c).length])) as Record<PotCondition, number>;
  const shown = filter === 'all' ? all : all.filter((p) => p.condition === filter);
  const placed = all.filter((p) => p.plotId).length;
  const anyTwin = all.some((p) => p.make === 'joined_terracotta' || p.shape === 'twin_pot');
  const openPlots = new Set(plotChoices.filter((p) => !p.lid).map((p) => p.id));
  const anyOpen = all.some((p) => p.plotId && openPlots.has(p.plotId));
  const filters: { id: Filter; label: string; count: number }[] = [
    { id: 'all', label: t(($) => $.shelf.all), count: all.length },
    ...potConditionSchema.options.map((c) => ({ id: c, label: t(($) => $.conditions[c]), count: counts[c] })),
  ];

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-3">
        <div className="min-w-0 flex-1">
          <h1>{t(($) => $.shelf.title)}</h1>
          <p className="text-ink-muted">
            {pots.isSuccess && all.length
              ? t(($) => $.shelf.summary, { pots: t(($) => $.shelf.pots, { count: all.length }), placed, shelved: all.length - placed })
              : t(($) => $.shelf.intro)}
          </p>
        </div>
        <Button id="add-pot-button" size="lg" aria-expanded={adding} aria-controls="add-pot" onClick={() => setAdding((v) => !v)}>
          {adding ? t(($) => $.shelf.closeForm) : t(($) => $.shelf.add)}
        </Button>
      </div>

      <p className="rounded-lg border border-slate-200 bg-slate-50 px-4 py-3 text-sm text-slate-800">
        {t(($) => $.shelf.frostNote)}{' '}
        <a href={`#${cautionAnchors.frost}`} className="font-medium underline">
          {t(($) => $.shelf.moreOnFrost)}
        </a>
      </p>

      {message ? (
        <Alert tone="success" className="flex items-center justify-between gap-3">
          <span>{message}</span>
          <Button variant="ghost" size="sm" onClick={() => setMessage(null)}>
            {t(($) => $.shelf.dismiss)}
          </Button>
        </Alert>
      ) : null}
      {plotsError ? <Alert tone="warning">{t(($) => $.shelf.plotsError, { error: plotsError })}</Alert> : null}

      {adding ? (
        <section id="add-pot" aria-labelledby="add-pot-heading" className="space-y-3 rounded-card border border-sand-200 bg-white p-4 shadow-sm sm:p-5">
          <h2 id="add-pot-heading">{t(($) => $.shelf.add)}</h2>
          <PotForm
            plotChoices={plotChoices}
            renderCaution={renderCaution}
            submitLabel={t(($) => $.shelf.addPot)}
            onCancel={() => {
              setAdding(false);
              focusAddButton();
            }}
            onSubmit={(input) =>
              create.mutateAsync(input).then((p) => {
                setAdding(false);
                setFilter('all');
                setMessage(p.plotLabel ? t(($) => $.shelf.addedPlaced, { pot: p.label, plot: p.plotLabel }) : t(($) => $.shelf.added, { pot: p.label }));
                focusAddButton();
              })
            }
          />
        </section>
      ) : null}

      <section aria-labelledby="pots-heading" className="space-y-4">
        <h2 id="pots-heading" className="sr-only">
          {t(($) => $.shelf.yourPots)}
        </h2>
        {all.length ? (
          <fieldset>
            <legend className="mb-2 text-sm font-medium">{t(($) => $.shelf.filter)}</legend>
            <div className="flex flex-wrap gap-2">
              {filters.map((f) => (
                <label
                  key={f.id}
                  className={cn(
                    'inline-flex min-h-11 cursor-pointer items-center gap-2 rounded-full border px-4 text-sm font-medium has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-terracotta-300',
                    filter === f.id ? 'border-terracotta-500 bg-terracotta-50 text-terracotta-800' : 'border-sand-300 bg-white text-ink hover:bg-sand-100',
                  )}
                >
                  <input type="radio" name="pot-condition-filter" value={f.id} checked={filter === f.id} onChange={() => setFilter(f.id)} className="sr-only" />
                  {f.label}
                  <span className="num text-ink-muted">{f.count}</span>
                </label>
              ))}
            </div>
          </fieldset>
        ) : null}

        {pots.isPending ? <p role="status">{t(($) => $.shelf.loading)}</p> : null}
        {pots.isError ? <Alert tone="error">{t(($) => $.shelf.loadError, { error: pots.error.message })}</Alert> : null}
        {pots.isSuccess && all.length === 0 && !adding ? (
          <div className="rounded-card border border-dashed border-sand-300 bg-white p-6 text-center">
            <p className="font-medium">{t(($) => $.shelf.empty)}</p>
            <p className="text-ink-muted">{t(($) => $.shelf.emptyHint)}</p>
          </div>
        ) : null}
        {pots.isSuccess && all.length > 0 && shown.length === 0 ? <p className="text-ink-muted">{t(($) => $.shelf.noneWith[filter as PotCondition])}</p> : null}

        <ul role="list" className="grid gap-4 md:grid-cols-2">
          {shown.map((pot) => (
            // An open card (tests and chart, edit form) takes the full width.
            <li key={pot.id} className="md:has-[[data-expanded=true]]:col-span-2">
              <PotCard pot={pot} plotChoices={plotChoices} renderCaution={renderCaution} onMessage={setMessage} />
            </li>
          ))}
        </ul>
      </section>

      <section aria-labelledby="care-heading" className="space-y-3">
        <h2 id="care-heading">{t(($) => $.shelf.cautions)}</h2>
        {anyTwin ? <div id={cautionAnchors.twinPotAdhesive} className="scroll-mt-6">{renderCaution('twinPotAdhesive')}</div> : null}
        {anyOpen ? <div id={cautionAnchors.openPotMosquitoes} className="scroll-mt-6">{renderCaution('openPotMosquitoes')}</div> : null}
        <div id={cautionAnchors.frost} className="scroll-mt-6">
          {renderCaution('frost')}
        </div>
      </section>
    </div>
  );
}
