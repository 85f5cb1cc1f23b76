import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PageMeta } from '@shared/schemas/common';
import type { ListLogsQuery, LogKind } from '@shared/schemas/logs';
import { api, qs } from '@/lib/api-client';
import { logKeys } from './keys';

/** A log row as the API returns it: its own fields plus plot label and who entered it. */
export type LogRow = Record<string, unknown> & { id: string; plotId: string | null; plotLabel: string | null; enteredBy: string | null; createdAt: string };

export const getLogs = (trialId: string, kind: LogKind, q: Partial<ListLogsQuery>) =>
  api.getWithMeta<LogRow[], PageMeta>(`/api/trials/${trialId}/${kind}${qs(q as Record<string, string | number | undefined>)}`);

export const logsQueryOptions = (trialId: string, kind: LogKind, q: Partial<ListLogsQuery>) =>
  queryOptions({ queryKey: logKeys.list(trialId, kind, q), queryFn: () => getLogs(trialId, kind, q), placeholderData: keepPreviousData });

export function useLogs(trialId: string, kind: LogKind, q: Partial<ListLogsQuery>) {
  return useQuery(logsQueryOptions(trialId, kind, q));
}
