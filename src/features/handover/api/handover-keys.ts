// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.

export const handoverKeys = {
  all: ['handover'] as const,
  unit: (unitId: number) => [...handoverKeys.all, 'unit', unitId] as const,
  current: (unitId: number) => [...handoverKeys.unit(unitId), 'current'] as const,
  one: (id: number) => [...handoverKeys.all, 'one', id] as const,
};
