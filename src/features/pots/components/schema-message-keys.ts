import type en from '@/locales/en/pots.json';

type Key = keyof (typeof en)['schema'];

/** The shared schemas' English messages this feature's forms can show, and their key in the `pots` namespace. */
export const schemaMessageKeys: Readonly<Record<string, Key>> = {
  'Give the pot a label.': 'label',
  'Capacity must be more than zero.': 'capacity',
  'Pots over 200 L are not garden ollas.': 'capacityMax',
  'Diameter must be more than zero.': 'diameter',
  'The neck cannot be wider than the widest part of the pot.': 'neck',
  'Litres lost cannot be negative.': 'lost',
  'The test must last some time.': 'hours',
  'Seep tests longer than two weeks are not plausible.': 'hoursMax',
};
