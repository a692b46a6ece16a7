// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.

export const trainingKeys = {
  all: ['training'] as const,
  tasks: () => [...trainingKeys.all, 'tasks'] as const,
  versions: (key: string) => [...trainingKeys.all, 'versions', key] as const,
  me: () => [...trainingKeys.all, 'me'] as const,
  trainee: (id: number) => [...trainingKeys.all, 'trainee', id] as const,
  countersign: () => [...trainingKeys.all, 'countersign'] as const,
  review: () => [...trainingKeys.all, 'review'] as const,
  crew: (id: number) => [...trainingKeys.all, 'crew', id] as const,
};
