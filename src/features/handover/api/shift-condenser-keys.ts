// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.

export const shiftCondenserKeys = {
  all: ['shift-condenser'] as const,
  unit: (unitId: number) => [...shiftCondenserKeys.all, unitId] as const,
  shift: (unitId: number, shiftStart: string | null) => [...shiftCondenserKeys.unit(unitId), shiftStart ?? 'in-progress'] as const,
};
