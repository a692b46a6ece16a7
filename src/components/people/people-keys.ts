// The people list's key alone, for the live-update map in the entry chunk (the picker loads with its pages).
export const peopleKeys = { all: ['plant', 'people'] as const };
