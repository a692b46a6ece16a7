// What GET /api/overview answers: the shift's front page, one panel per unit, and what waits on the
// person asking. Times are UTC ISO strings with the station's zone beside them; numbers are SI.
import type { CheckKey, Quantity } from '../calc/check-catalog';
import type { Status } from '../calc/limits';
import type { ConditionState } from '../conditions';

/** The checks the front page shows from the latest round, in this order. */
export const overviewCheckKeys = [
  'backpressure',
  'expectedBackpressure',
  'saturationTemperature',
  'subcooling',
  'ttd',
  'cwRise',
  'cleanlinessFactor',
  'deviationCostPower',
] as const satisfies readonly CheckKey[];

export type OverviewCheck = { key: CheckKey; label: string; quantity: Quantity; value: number | null; status: Status; reason: string | null };

export type OverviewCrew = { id: number; name: string };

export type OverviewShift = {
  shiftStart: string;
  /** The next shift change. */
  changeAt: string;
  crewOnShift: OverviewCrew | null;
  incomingCrew: OverviewCrew | null;
  /** Active crew members (trainees, operators, shift leads) of the crew on shift. */
  people: { id: number; name: string; role: string }[];
};

export type OverviewRound = {
  id: number;
  takenAt: string;
  recordedBy: string;
  recordedAsTrainee: boolean;
  needsCountersign: boolean;
  amended: boolean;
  /** Age at `serverNow`; the browser counts on from it. */
  ageMs: number;
  overdue: boolean;
  worstStatus: Status;
  checks: OverviewCheck[];
};

export type OverviewFlag = {
  id: number;
  parameter: string;
  parameterLabel: string;
  quantity: Quantity | null;
  origin: 'automatic' | 'manual';
  severity: 'watch' | 'alarm';
  lastValue: number | null;
  raisedAt: string;
};

export type OverviewCondition = { id: number; title: string; limitAt: string; limitLocal: string; remainingMs: number; state: ConditionState };

export type OverviewHandover =
  | { state: 'none'; id: null; changeAt: string }
  | { state: 'draft'; id: number; changeAt: string }
  /** `acknowledgementsOutstanding`: for items amended after the turnover. */
  | { state: 'accepted'; id: number; changeAt: string; acknowledgementsOutstanding: number }
  | { state: 'submitted'; id: number; changeAt: string; acknowledgementsOutstanding: number; openQuestions: number };

export type OverviewUnit = {
  unit: { id: number; code: string; name: string; stationId: number; station: string };
  timeZone: string;
  roundIntervalMinutes: number;
  shift: OverviewShift;
  round: OverviewRound | null;
  flags: { open: { alarm: number; watch: number }; top: OverviewFlag[] };
  conditions: OverviewCondition[];
  handover: OverviewHandover;
};

export type WaitingOnYou = {
  handoverItems: { itemId: number; handoverId: number; unitId: number; unitName: string; title: string; priority: 'low' | 'normal' | 'high' }[];
  handoverQuestions: { queryId: number; unitId: number; unitName: string; itemTitle: string; question: string }[];
  handoversToAccept: { handoverId: number; unitId: number; unitName: string }[];
  traineeRounds: { id: number; unitId: number; unitName: string; takenAt: string; timeZone: string; recordedBy: string }[];
  trainingEntries: { id: number; trainee: string; taskTitle: string; performedOn: string; level: string }[];
  standingOrders: { id: number; title: string; effectiveFrom: string }[];
  reviewComments: { id: number; documentId: number; about: string; author: string; body: string; createdAt: string; unitId: number | null; shiftStart: string | null }[];
};

export type Overview = { serverNow: string; units: OverviewUnit[]; waiting: WaitingOnYou };
