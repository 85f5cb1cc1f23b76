import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** One e-mail captured by the development mail sink (GET /api/admin/outbox; no shared schema yet). */
export interface OutboxMessage {
  id: number;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

export interface Outbox {
  available: boolean;
  message: string | null;
  messages: OutboxMessage[];
}

export async function getOutbox(): Promise<Outbox> {
  const res = await api.getWithMeta<OutboxMessage[], { available?: boolean; message?: string }>('/api/admin/outbox');
  return { available: res.meta?.available ?? true, message: res.meta?.message ?? null, messages: res.data };
}

export const outboxQueryOptions = () => queryOptions({ queryKey: ['admin', 'outbox'] as const, queryFn: getOutbox, staleTime: 0 });

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
