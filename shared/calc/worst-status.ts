import { checkKeys } from './check-catalog';
import type { Evaluation } from './evaluate';
import type { Status } from './limits';

const rank: Record<Status, number> = { unknown: 0, normal: 1, watch: 2, alarm: 3 };

/** The round's status: its worst judged check (a check without a value does not count). */
export function worstOf(evaluation: Evaluation): Status {
  let worst: Status = 'normal';
  for (const key of checkKeys) {
    const status = evaluation.checks[key].status;
    if (status !== 'unknown' && rank[status] > rank[worst]) worst = status;
  }
  return worst;
}
