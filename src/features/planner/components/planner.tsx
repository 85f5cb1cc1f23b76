import { BedPlanner } from './bed-planner';
import { PairsPlanner } from './pairs-planner';
import { RefillPlanner } from './refill-planner';
import type { PlannerPot, PlannerTrial, RenderCaution } from './types';

/** The Planner: pots for a bed, how often to refill, and how many pairs a trial needs. All sums run here in the browser. */
export function Planner({ trials, pots, renderCaution }: { trials: PlannerTrial[]; pots: PlannerPot[]; renderCaution: RenderCaution }) {
  return (
    <div className="space-y-6">
      <div>
        <h1>Planner</h1>
        <p className="text-ink-muted">Sums for the spring: how many pots a bed takes and where, how often they need filling, and how many pairs of beds a fair trial needs.</p>
      </div>
      <nav aria-label="Planner sections" className="flex flex-wrap gap-2 text-sm">
        <a href="#bed-heading" className="inline-flex min-h-11 items-center rounded-full border border-sand-300 bg-white px-4 font-medium hover:bg-sand-100">
          Pots for a bed
        </a>
        <a href="#refill-heading" className="inline-flex min-h-11 items-center rounded-full border border-sand-300 bg-white px-4 font-medium hover:bg-sand-100">
          Refill interval
        </a>
        <a href="#pairs-heading" className="inline-flex min-h-11 items-center rounded-full border border-sand-300 bg-white px-4 font-medium hover:bg-sand-100">
          Pairs for a trial
        </a>
      </nav>
      <BedPlanner />
      <RefillPlanner pots={pots} renderCaution={renderCaution} />
      <PairsPlanner trials={trials} />
    </div>
  );
}
