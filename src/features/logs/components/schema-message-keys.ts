import type en from '@/locales/en/logs.json';

type Key = keyof (typeof en)['schema'];

/** The shared schemas' English messages this feature's forms can show, and their key in the `logs` namespace. */
export const schemaMessageKeys: Readonly<Record<string, Key>> = {
  'Volume must be more than zero.': 'volume',
  'Deeper than 2 m is beyond a garden probe.': 'depth',
  'Mass cannot be negative.': 'mass',
  'Marketable mass cannot exceed the fresh mass.': 'marketable',
  'Write what you saw.': 'text',
  'Use a date and time like 2027-05-14T07:30:00Z.': 'dateTime',
  'Use a date like 2027-05-14.': 'date',
  'The minimum temperature is above the maximum.': 'tMinAboveMax',
  'Minimum humidity is above the maximum.': 'rhMinAboveMax',
};
