// Who may do what, by role: the one table the server's routes authorise from, the access-matrix test
// checks every route against, and the browser asks for its navigation and buttons. Rules that also
// depend on the record — whose log entry, which crew's shift, which side of a handover — live with
// their kind in this folder (log.ts, training.ts, handover.ts, review.ts) and start from this table.
//
// Administrators administer: people, shifts, plant setup, station settings, the audit trail and the
// training catalogue. They write no operational record (rounds, flags, log, conditions, standing
// orders, imports, training decisions, review comments): what the crews record stays the crews'.
import type { Role } from '../roles';

/** Everyone who works a shift on a crew. */
const onShift = ['trainee', 'operator', 'shift_lead'] as const satisfies readonly Role[];
/** Qualified crew: what a trainee may not yet do alone. */
const qualified = ['operator', 'shift_lead'] as const satisfies readonly Role[];

export const permissions = {
  // Administration
  'people.manage': ['admin'],
  'audit.read': ['admin'],
  'plant.manage': ['admin'],
  'shifts.manage': ['admin'],
  'station.settings': ['admin'],

  // Rounds: a trainee's round waits for a qualified crew member's countersign.
  'reading.record': onShift,
  'reading.amend': qualified,
  'reading.countersign': qualified,
  'import.run': qualified,
  // Flags: the shift lead owns abnormal readings.
  'flag.manage': ['shift_lead'],

  // Narrative log. Whose entries each may amend: log.ts.
  'log.write': onShift,
  'log.amend': onShift,
  'log.review': ['shift_lead'],
  'condition.manage': qualified,
  'order.issue': ['shift_lead'],
  /** Which orders: those addressed to the person's crew and position (the service checks). */
  'order.acknowledge': onShift,

  // Handover. Which side of it: handover.ts.
  'handover.take-part': onShift,
  'handover.attach': qualified,

  // Training and review. Whose records: training.ts and review.ts.
  'review.comment': ['trainer'],
  /** Reads every review comment; others read those on their own records and their crew's: review.ts. */
  'review.read-all': ['trainer', 'shift_lead', 'admin'],
  'training.catalogue': ['trainer', 'admin'],
  'training.practice': ['trainee'],
  'training.countersign': qualified,
  'training.decide': ['trainer'],
  'training.amend': ['trainee', 'trainer'],
  'training.review-queue': ['trainer', 'admin'],
  'training.crews': ['operator', 'shift_lead', 'trainer', 'admin'],
  'training.progress-of-others': ['shift_lead', 'trainer', 'admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof permissions;

export const rolesFor = (action: Action): readonly Role[] => permissions[action];
export const can = (role: Role, action: Action): boolean => rolesFor(action).includes(role);
