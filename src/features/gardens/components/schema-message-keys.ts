import type en from '@/locales/en/gardens.json';

type Key = keyof (typeof en)['schema'];

/** The shared schemas' English messages this feature's forms can show, and their key in the `gardens` namespace. */
export const schemaMessageKeys: Readonly<Record<string, Key>> = {
  'Give the garden a name.': 'name',
  'Latitude is between −90 and 90.': 'latitude',
  'Longitude is between −180 and 180.': 'longitude',
  'Elevation below the Dead Sea shore is not plausible.': 'elevationLow',
  'Elevation above 5000 m is not plausible for a garden.': 'elevationHigh',
  'Minimum humidity is above the maximum.': 'humidity',
  'The minimum temperature is above the maximum.': 'temperature',
  'Choose a time zone from the list (an IANA name like America/Denver).': 'timeZone',
};
