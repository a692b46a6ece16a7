// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.
export const importKeys = { all: ['imports'] as const, mappings: (unitId: number) => [...importKeys.all, 'mappings', unitId] as const };
