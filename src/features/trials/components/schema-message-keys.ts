import type en from '@/locales/en/trials.json';

type Key = keyof (typeof en)['schema'];

/** The shared schemas' English messages this feature's forms can show, and their key in the `trials` namespace. */
export const schemaMessageKeys: Readonly<Record<string, Key>> = {
  'Give the trial a title.': 'title',
  'Name the crop.': 'cropName',
  'The end date is before the planting date.': 'endDate',
  'Treatment names must differ.': 'treatmentsDiffer',
  'A paired trial compares exactly "olla" and "surface".': 'pairedTreatments',
  'Use letters, digits, spaces, - and _ in treatment names.': 'treatmentChars',
  'Give the plot a label.': 'plotLabel',
  'Say which pair or block the plot is in.': 'plotPair',
  'Area must be more than zero.': 'area',
  'Plots over 1 ha are not garden plots.': 'areaMax',
  'Use a date like 2027-05-14.': 'date',
};
