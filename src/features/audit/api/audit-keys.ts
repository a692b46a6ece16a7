export const auditKeys = {
  all: ['audit'] as const,
  list: () => [...auditKeys.all, 'list'] as const,
};
