// What the server tells open browsers after a change commits: which kind of record changed, which
// one, and where. Browsers then refetch what they show of it (sockets notify, queries fetch).
// The client's map from entity to query keys is typed over this list, so a new kind of record
// cannot go live on one side and be forgotten on the other.
export const liveEntities = [
  'reading',
  'flag',
  'import',
  'log_entry',
  'log_review',
  'condition',
  'standing_order',
  'handover',
  'training',
  'plant',
  'people',
  'station_settings',
  'review_comment',
] as const;

export type LiveEntity = (typeof liveEntities)[number];

export type LiveEvent = {
  entity: LiveEntity;
  id: number | string;
  /** The unit whose records changed: sent to the browsers watching that unit. */
  unitId?: number;
  /** Only for one person (their review comments, their training record). */
  userId?: number;
};

/** Presence on a unit's handover board: who has it open now. */
export type BoardPresence = { unitId: number; people: string[] };
