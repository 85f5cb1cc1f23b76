import { useQueryClient } from '@tanstack/react-query';
import { potKeys } from './keys';

/** After a pot changes: every pot list, and the Round of each trial the pot left or joined. */
export function useRefreshPots() {
  const qc = useQueryClient();
  return (trialIds: (string | null | undefined)[] = []) =>
    Promise.all([
      qc.invalidateQueries({ queryKey: potKeys.all }),
      ...[...new Set(trialIds.filter((id): id is string => Boolean(id)))].map((id) => qc.invalidateQueries({ queryKey: potKeys.round(id) })),
    ]);
}
