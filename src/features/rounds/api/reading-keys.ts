export const readingKeys = {
  all: ['readings'] as const,
  list: (unitId: number) => [...readingKeys.all, 'list', unitId] as const,
  detail: (id: number) => [...readingKeys.all, 'detail', id] as const,
};
