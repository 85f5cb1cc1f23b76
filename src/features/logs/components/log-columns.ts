import type { LogKind } from '@shared/schemas/logs';
import type { Quantity } from '@shared/units';

/** What each log kind shows in its table: field, header, and the quantity for unit conversion. */
export interface LogColumn {
  field: string;
  header: string;
  quantity?: Quantity;
  digits?: number;
  numeric?: boolean;
}

export const logTitles: Record<LogKind, string> = {
  'water-events': 'Water',
  'moisture-readings': 'Soil moisture',
  harvests: 'Harvests',
  observations: 'Notes',
};

export const logColumns: Record<LogKind, LogColumn[]> = {
  'water-events': [
    { field: 'occurredAt', header: 'When' },
    { field: 'plotLabel', header: 'Plot' },
    { field: 'kind', header: 'Kind' },
    { field: 'volumeL', header: 'Volume', quantity: 'volume', digits: 2, numeric: true },
    { field: 'source', header: 'Source' },
    { field: 'fertiliser', header: 'Fertiliser' },
  ],
  'moisture-readings': [
    { field: 'takenAt', header: 'When' },
    { field: 'plotLabel', header: 'Plot' },
    { field: 'method', header: 'Method' },
    { field: 'depthCm', header: 'Depth (cm)', numeric: true },
    { field: 'value', header: 'Reading', numeric: true },
  ],
  harvests: [
    { field: 'harvestedOn', header: 'Day' },
    { field: 'plotLabel', header: 'Plot' },
    { field: 'freshKg', header: 'Fresh mass', quantity: 'mass', digits: 2, numeric: true },
    { field: 'marketableKg', header: 'Marketable', quantity: 'mass', digits: 2, numeric: true },
    { field: 'count', header: 'Count', numeric: true },
  ],
  observations: [
    { field: 'observedAt', header: 'When' },
    { field: 'plotLabel', header: 'Plot' },
    { field: 'text', header: 'Note' },
  ],
};
