// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.

export const setupKeys = {
  all: ['plant', 'setup'] as const,
  unit: (id: number) => [...setupKeys.all, id] as const,
  /** The unit's equipment list as the log's picker keeps it (the same endpoint, cached apart). */
  equipment: (id: number) => [...setupKeys.unit(id), 'equipment'] as const,
};
