import type { ListLogsQuery, LogKind } from '@shared/schemas/logs';
import { queryRoots } from '@/lib/query-roots';

/** Query keys of the log tables, built only here. ['logs', trialId] prefixes everything of a trial. */
export const logKeys = {
  trial: queryRoots.logs,
  list: (trialId: string, kind: LogKind, q: Partial<ListLogsQuery>) => [...queryRoots.logs(trialId), kind, q] as const,
  photos: (trialId: string, observationId: string) => [...queryRoots.logs(trialId), 'photos', observationId] as const,
};
