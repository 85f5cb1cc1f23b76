import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

/** The shape GET /api/admin/health sends (no shared schema for it yet). */
export interface AdminHealth {
  database: { status: string; latencyMs: number; version: string; migrationsApplied: number };
  counts: { users: number; cohorts: number; activeSessions: number };
  process: { uptimeS: number; rssMb: number; heapUsedMb: number; node: string };
  /** Where mail goes: the development sink (the Outbox tab) or a real SMTP server. */
  mail: { mode: 'sink' | 'smtp' };
}

export function getHealth(): Promise<AdminHealth> {
  return api.get<AdminHealth>('/api/admin/health');
}

export const healthQueryOptions = () => queryOptions({ queryKey: ['admin', 'health'] as const, queryFn: getHealth, staleTime: 0 });

export function useHealth() {
  return useQuery(healthQueryOptions());
}
