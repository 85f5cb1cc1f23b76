import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { trialKeys } from './keys';

export interface AuditEntry {
  id: string;
  at: string;
  action: 'create' | 'update' | 'delete' | 'status';
  entityType: string;
  entityId: string;
  changes: Record<string, unknown>;
  actor: string | null;
}

export const getAudit = (trialId: string) => api.get<AuditEntry[]>(`/api/trials/${trialId}/audit`);

export const auditQueryOptions = (trialId: string) => queryOptions({ queryKey: trialKeys.audit(trialId), queryFn: () => getAudit(trialId) });

export function useAudit(trialId: string, enabled = true) {
  return useQuery({ ...auditQueryOptions(trialId), enabled });
}
