import { useQueries } from '@tanstack/react-query';
import { useCurrentUser } from '@/features/auth/api/get-session';
import { CautionNote } from '@/features/guides/components/caution-note';
import { PotShelf } from '@/features/pots/components/pot-shelf';
import type { PlotChoice, RenderCaution } from '@/features/pots/components/types';
import { plotsQueryOptions } from '@/features/trials/api/get-plots';
import { useTrials } from '@/features/trials/api/get-trials';

/** The Pot shelf, with the plots of the grower's own trials as the places a pot can go. */
export function PotsPage() {
  const user = useCurrentUser();
  const trials = useTrials();
  const own = (trials.data ?? []).filter((t) => t.access === 'owner');
  const plots = useQueries({ queries: own.map((t) => plotsQueryOptions(t.id)) });
  const plotChoices: PlotChoice[] = own.flatMap((t, i) =>
    (plots[i]?.data ?? []).map((p) => ({
      id: p.id,
      label: p.label,
      trialId: t.id,
      trialTitle: t.title,
      trialClosed: t.status === 'closed',
      treatment: p.treatment,
      lid: p.lid,
    })),
  );
  const plotsError = trials.error?.message ?? plots.find((q) => q.error)?.error?.message ?? null;
  const renderCaution: RenderCaution = (id, options) => <CautionNote id={id} lang={user?.language ?? 'en'} headingLevel={options?.headingLevel ?? 3} anchorId={options?.anchorId} />;
  return <PotShelf plotChoices={plotChoices} plotsError={plotsError} renderCaution={renderCaution} />;
}
