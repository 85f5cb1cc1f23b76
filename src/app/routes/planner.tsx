import { useCurrentUser } from '@/features/auth/api/get-session';
import { CautionNote } from '@/features/guides/components/caution-note';
import { Planner } from '@/features/planner/components/planner';
import type { PlannerPot, PlannerTrial, RenderCaution } from '@/features/planner/components/types';
import { usePots } from '@/features/pots/api/get-pots';
import { useTrials } from '@/features/trials/api/get-trials';

/** The Planner, with the grower's own trials (for a measured spread) and shelf pots (for refill sums). */
export function PlannerPage() {
  const user = useCurrentUser();
  const trials = useTrials();
  const pots = usePots();
  const plannerTrials: PlannerTrial[] = (trials.data ?? []).filter((t) => t.access === 'owner').map((t) => ({ id: t.id, title: t.title, closed: t.status === 'closed' }));
  const plannerPots: PlannerPot[] = (pots.data ?? [])
    .filter((p) => p.condition !== 'retired')
    .map((p) => ({ id: p.id, label: p.label, capacityL: p.capacityL, widestDiameterCm: p.widestDiameterCm, latestSeepLitresPerDay: p.latestSeepLitresPerDay }));
  const renderCaution: RenderCaution = (id, options) => <CautionNote id={id} lang={user?.language ?? 'en'} headingLevel={options?.headingLevel ?? 3} />;
  return <Planner trials={plannerTrials} pots={plannerPots} renderCaution={renderCaution} />;
}
