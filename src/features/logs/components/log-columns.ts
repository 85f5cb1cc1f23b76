import type { LogKind } from '@shared/schemas/logs';
import type { Quantity } from '@shared/units';
import type logs from '@/locales/en/logs.json';

/** A column header: a key of the `logs` namespace's `col` group. */
export type LogColumnHeader = keyof typeof logs.col;

/** What each log kind shows in its table: field, header (translated in the `logs` namespace), and the quantity for unit conversion. */
export interface LogColumn {
  field: string;
  header: LogColumnHeader;
  quantity?: Quantity;
  digits?: number;
  numeric?: boolean;
}

export const logColumns: Record<LogKind, LogColumn[]> = {
  'water-events': [
    { field: 'occurredAt', header: 'when' },
    { field: 'plotLabel', header: 'plot' },
    { field: 'kind', header: 'kind' },
    { field: 'volumeL', header: 'volume', quantity: 'volume', digits: 2, numeric: true },
    { field: 'source', header: 'source' },
    { field: 'fertiliser', header: 'fertiliser' },
  ],
  'moisture-readings': [
    { field: 'takenAt', header: 'when' },
    { field: 'plotLabel', header: 'plot' },
    { field: 'method', header: 'method' },
    { field: 'depthCm', header: 'depth', numeric: true },
    { field: 'value', header: 'reading', numeric: true },
  ],
  harvests: [
    { field: 'harvestedOn', header: 'day' },
    { field: 'plotLabel', header: 'plot' },
    { field: 'freshKg', header: 'fresh', quantity: 'mass', digits: 2, numeric: true },
    { field: 'marketableKg', header: 'marketable', quantity: 'mass', digits: 2, numeric: true },
    { field: 'count', header: 'count', numeric: true },
  ],
  observations: [
    { field: 'observedAt', header: 'when' },
    { field: 'plotLabel', header: 'plot' },
    { field: 'text', header: 'note' },
  ],
};
