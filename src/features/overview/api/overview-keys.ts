// One key family for the front page, so live updates and mutations invalidate it without retyping keys.
export const overviewKeys = {
  all: ['overview'] as const,
  /** The whole front page for the signed-in person: every unit's panel and what waits on them. */
  page: () => [...overviewKeys.all, 'page'] as const,
};
