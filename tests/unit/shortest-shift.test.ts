import { describe, expect, it } from 'vitest';
import { shortestShiftMinutes } from '../../shared/schemas/log';

// Plain clock arithmetic: the gaps between consecutive change times, the last one wrapping past midnight.
describe('shortestShiftMinutes', () => {
  it.each([
    [['06:00', '18:00'], 12 * 60],
    [['06:00', '14:00', '22:00'], 8 * 60],
    [['22:00', '06:00', '14:00'], 8 * 60],
    [['07:00', '15:30', '23:00'], 7.5 * 60],
    [['23:00', '01:00'], 2 * 60],
    [['06:00'], 24 * 60],
  ])('%j → %i minutes', (times, minutes) => {
    expect(shortestShiftMinutes(times)).toBe(minutes);
  });
});
