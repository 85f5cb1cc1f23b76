import { useTranslation } from 'react-i18next';
import { BedPlanner } from './bed-planner';
import { PairsPlanner } from './pairs-planner';
import { RefillPlanner } from './refill-planner';
import type { PlannerPot, PlannerTrial, RenderCaution } from './types';

/** The Planner: pots for a bed, how often to refill, and how many pairs a trial needs. All sums run here in the browser. */
export function Planner({ trials, pots, renderCaution }: { trials: PlannerTrial[]; pots: PlannerPot[]; renderCaution: RenderCaution }) {
  const { t } = useTranslation('planner');
  return (
    <div className="space-y-6">
      <div>
        <h1>{t(($) => $.title)}</h1>
        <p className="text-ink-muted">{t(($) => $.intro)}</p>
      </div>
      <nav aria-label={t(($) => $.sections)} className="flex flex-wrap gap-2 text-sm">
        <a href="#bed-heading" className="inline-flex min-h-11 items-center rounded-full border border-sand-300 bg-white px-4 font-medium hover:bg-sand-100">
          {t(($) => $.nav.bed)}
        </a>
        <a href="#refill-heading" className="inline-flex min-h-11 items-center rounded-full border border-sand-300 bg-white px-4 font-medium hover:bg-sand-100">
          {t(($) => $.nav.refill)}
        </a>
        <a href="#pairs-heading" className="inline-flex min-h-11 items-center rounded-full border border-sand-300 bg-white px-4 font-medium hover:bg-sand-100">
          {t(($) => $.nav.pairs)}
        </a>
      </nav>
      <BedPlanner />
      <RefillPlanner pots={pots} renderCaution={renderCaution} />
      <PairsPlanner trials={trials} />
    </div>
  );
}
