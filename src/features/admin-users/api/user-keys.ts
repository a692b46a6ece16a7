export const userKeys = {
  all: ['admin-users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};
