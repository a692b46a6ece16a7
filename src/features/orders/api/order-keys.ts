// Query keys only, apart from the fetchers, so the live-update map in the entry chunk does not carry this feature's code.

export const orderKeys = {
  all: ['orders'] as const,
  list: (state: string, q: string) => [...orderKeys.all, 'list', state, q] as const,
  detail: (id: number) => [...orderKeys.all, 'detail', id] as const,
  /** The signed-in person's orders still to acknowledge. */
  pending: () => [...orderKeys.all, 'pending'] as const,
};
