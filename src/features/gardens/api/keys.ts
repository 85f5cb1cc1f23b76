/** Query keys of the garden feature, built only here. */
export const gardenKeys = {
  all: ['gardens'] as const,
  list: ['gardens', 'list'] as const,
  detail: (id: string) => ['gardens', 'detail', id] as const,
  weatherAll: (gardenId: string) => ['weather', 'list', gardenId] as const,
  weather: (gardenId: string, from?: string, to?: string) => ['weather', 'list', gardenId, { from, to }] as const,
};
