// The declared access policy of every API route, for access-matrix.test.ts: who may call it (the
// shared permission table's action, or public / any signed-in person), and a valid request for each
// caller. Where the record decides beyond the role (which crew's handover, whose training record),
// `refused` names the roles the table lets in but this record turns away. `side: 'incoming'` has the
// crew's roles act as members of the incoming crew; otherwise they are the outgoing crew.
import type { Action } from '../../../shared/policies/permissions';
import type { Role } from '../../../shared/roles';
import { startingLimits } from '../../../shared/calc/limits';
import { handBuiltDesign } from '../../fixtures/hand-built-design';
import { vacuumRound } from './rounds';
import type { Agent } from './test-app';
import { widestPlausibleRanges } from '../../fixtures/widest-plausible-ranges';

export type Who = Role | 'pending' | 'anonymous';
export type Access = 'public' | 'signed-in' | 'signed-in, temporary password too' | Action;
export type Call = {
  path: string;
  body?: unknown;
  /** multipart: a file and text fields */
  file?: { buffer: Buffer; name: string };
  fields?: Record<string, string>;
  /** Another agent than the caller's own (for calls that end or replace the caller's session). */
  agent?: Agent;
  after?: (res: { status: number; body: Record<string, unknown> }) => void;
};
export type Policy = {
  access: Access;
  side?: 'incoming';
  refused?: Partial<Record<Role, string>>;
  /** `allowed`: the caller passes the role check, so per-caller records are worth making. */
  call: (who: Who, allowed: boolean) => Call | Promise<Call>;
};

/** What the declarations need from the test: fixtures, made once, and helpers that make more. */
export type Fixtures = {
  unitId: number;
  stationId: number;
  crewA: number;
  crewB: number;
  leadA: number;
  traineeA: number;
  shiftStart: string;
  laterShiftStart: string;
  agentOf: (who: Who, side?: 'incoming') => Agent;
  post: (agent: Agent, path: string, body: unknown) => Promise<{ status: number; body: Record<string, unknown> }>;
  get: (agent: Agent, path: string) => Promise<Record<string, unknown>>;
  /** A person of their own for `who` (signed in, or for 'anonymous' an agent that is not) and that person's e-mail. */
  throwawayAgent: (who: Who) => Promise<{ agent: Agent; email: string; password: string }>;
  newUser: () => Promise<{ id: number; version: number }>;
  ids: Record<string, number>;
  /** Made once, the first time a call needs it. */
  remember: <T>(name: string, make: () => Promise<T>) => Promise<T>;
  unique: () => number;
};

const now = () => new Date().toISOString();
const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=', 'base64');
const csv = Buffer.from('Timestamp,Cond press,Hotwell,CW in,CW out,CW flow\n2026-03-01T00:00:00Z,6.1,35.8,20.1,28.9,54000\n');
const mapping = JSON.stringify({
  source: 'Historian hourly export',
  timeColumn: 'Timestamp',
  columns: {
    pressure: { column: 'Cond press', unit: 'kPa_a' },
    hotwellTemperature: { column: 'Hotwell', unit: 'degC' },
    cwInletTemperature: { column: 'CW in', unit: 'degC' },
    cwOutletTemperature: { column: 'CW out', unit: 'degC' },
    cwFlow: { column: 'CW flow', unit: 'm3_h' },
  },
});
const task = { position: 'field_operator', system: 'circulating_water', title: 'Start a circulating-water pump', standard: 'Starts the pump per procedure', procedureRef: 'TST-1', requiredPerformances: 1 };
const outgoingOnly = { trainee: 'a trainee does not write the handover' } as const;
const leadOnly = { trainee: 'only the incoming lead accepts', operator: 'only the incoming lead accepts' } as const;

export function accessPolicies(f: Fixtures): Record<string, Policy> {
  const u = `/api/units/${f.unitId}`;
  const as = (who: Who, side?: 'incoming') => f.agentOf(who, side);
  const created = async (who: Who, path: string, body: unknown, side?: 'incoming') => {
    const res = await f.post(as(who, side), path, body);
    if (res.status !== 201 && res.status !== 200) throw new Error(`making a fixture at ${path} answered ${res.status}: ${JSON.stringify(res.body)}`);
    return res.body;
  };
  const taskKey = () => `AM-${1000 + f.unique()}`;
  const newTask = async () => {
    const key = taskKey();
    await created('trainer', '/api/training/tasks', { ...task, taskKey: key });
    return key;
  };
  const sharedTask = () => f.remember('task', newTask);
  const traineeEntry = async () => Number((await created('trainee', '/api/training/entries', { taskKey: await sharedTask(), performedOn: now().slice(0, 10), level: 'supervised', note: 'With the lead' })).id);
  const roundByTrainee = async () => Number((await created('trainee', `${u}/readings`, vacuumRound())).id);
  const flag = async () => (await created('shift_lead', `${u}/flags`, { parameter: 'ttd', severity: 'watch', comment: 'Watch the TTD' })).flag as { id: number; version: number };
  const handover = async () => f.ids.handover ?? f.remember('handover', async () => Number(((await created('operator', `${u}/handovers/current`, {})).board as { handover: { id: number } }).handover.id));
  const board = async () => (await f.get(as('operator'), `/api/handovers/${await handover()}`)).board as { handover: { notesVersion: number }; items: { id: number; version: number; queries: { id: number; answeredAt: string | null }[] }[] };
  const newItem = async () => Number((await created('operator', `/api/handovers/${await handover()}/items`, { kind: 'equipment', title: `Item ${f.unique()}` })).id);
  const firstItem = async () => (await board()).items[0]!.id;
  const question = async () => Number((await created('operator', `/api/handover-items/${await firstItem()}/queries`, { question: 'Is the seal water on?' }, 'incoming')).id);
  const readyToAccept = async () => {
    const b = await board();
    for (const item of b.items) {
      for (const member of ['trainee', 'operator', 'shift_lead'] as const) await f.post(f.agentOf(member, 'incoming'), `/api/handover-items/${item.id}/acknowledge`, {});
      for (const q of item.queries.filter((q) => !q.answeredAt)) await created('operator', `/api/handover-queries/${q.id}/answer`, { answer: 'Yes' });
    }
  };
  const order = () => f.remember('order', async () => Number(((await created('shift_lead', `/api/standing-orders?stationId=${f.stationId}`, { title: 'Hourly TTD', bodyHtml: '<p>Log TTD hourly.</p>', effectiveFrom: now() })).order as { id: number }).id));
  const logDocument = () => f.remember('document', async () => {
    const hits = (await f.get(as('trainer'), `/api/logbook/search?unitId=${f.unitId}&kind=log_entry`)).hits as { documentId: number }[];
    return hits[0]!.documentId;
  });
  const attachment = async () => f.ids.attachment ?? f.remember('attachment', async () => {
    const res = await as('operator').post(`/api/handover-items/${await firstItem()}/attachments`).set('X-CSRF-Token', as('operator').csrf).field('reason', 'Photo of the gauge').attach('file', png, 'gauge.png');
    return Number(res.body.id);
  });
  const settings = async () => (await f.get(as('admin'), `/api/stations/${f.stationId}/settings`)).settings;

  const p = (access: Access, call: Policy['call'], more: Partial<Policy> = {}): Policy => ({ access, call, ...more });
  return {
    'GET /api/health': p('public', () => ({ path: '/api/health' })),
    'GET /api/ready': p('public', () => ({ path: '/api/ready' })),
    'GET /api/session/csrf': p('public', () => ({ path: '/api/session/csrf' })),
    // Signing in (again) replaces a session: each caller does it as a person of their own.
    'POST /api/session': p('public', async (who) => {
      const { agent, email, password } = await f.throwawayAgent(who);
      return { path: '/api/session', agent, body: { email, password } };
    }),
    'DELETE /api/session': p('public', async (who) => ({ path: '/api/session', agent: (await f.throwawayAgent(who)).agent })),
    'GET /api/me': p('signed-in, temporary password too', () => ({ path: '/api/me' })),
    'POST /api/me/password': p('signed-in, temporary password too', async (who, allowed) => {
      if (!allowed) return { path: '/api/me/password', body: { currentPassword: 'x', newPassword: 'y' } };
      const { agent, password } = await f.throwawayAgent(who);
      return { path: '/api/me/password', agent, body: { currentPassword: password, newPassword: `slate otter cobalt lantern ${f.unique()}` } };
    }),

    'GET /api/admin/users': p('people.manage', () => ({ path: '/api/admin/users' })),
    'POST /api/admin/users': p('people.manage', () => ({ path: '/api/admin/users', body: { name: 'Matrix Newcomer', email: `matrix.${f.unique()}@test.example`, role: 'operator', crewId: null, temporaryPassword: 'first shift kestrel 83' } })),
    'PATCH /api/admin/users/:id': p('people.manage', async (_w, allowed) => {
      const target = allowed ? await f.newUser() : { id: 1, version: 0 };
      return { path: `/api/admin/users/${target.id}`, body: { crewId: null, version: target.version } };
    }),
    'POST /api/admin/users/:id/deactivate': p('people.manage', async (_w, allowed) => {
      const target = allowed ? await f.newUser() : { id: 1, version: 0 };
      return { path: `/api/admin/users/${target.id}/deactivate`, body: { version: target.version } };
    }),
    'POST /api/admin/users/:id/reactivate': p('people.manage', async (_w, allowed) => {
      const target = allowed ? await f.newUser() : { id: 1, version: 0 };
      return { path: `/api/admin/users/${target.id}/reactivate`, body: { version: target.version } };
    }),
    'GET /api/admin/audit-events': p('audit.read', () => ({ path: '/api/admin/audit-events' })),

    'GET /api/plant/crews': p('signed-in', () => ({ path: '/api/plant/crews' })),
    'GET /api/plant/units': p('signed-in', () => ({ path: '/api/plant/units' })),
    'GET /api/plant/people': p('signed-in', () => ({ path: '/api/plant/people' })),
    'GET /api/plant/units/:unitId/setup': p('signed-in', () => ({ path: `/api/plant/units/${f.unitId}/setup` })),
    'POST /api/plant/units/:unitId/design-versions': p('plant.manage', () => ({ path: `/api/plant/units/${f.unitId}/design-versions`, body: { design: handBuiltDesign, note: 'Data sheet re-entered' } })),
    'POST /api/plant/units/:unitId/plausible-range-versions': p('plant.manage', () => ({ path: `/api/plant/units/${f.unitId}/plausible-range-versions`, body: { ranges: widestPlausibleRanges, note: 'Ranges re-entered' } })),
    'POST /api/plant/units/:unitId/limit-versions': p('plant.manage', () => ({ path: `/api/plant/units/${f.unitId}/limit-versions`, body: { limits: startingLimits, note: 'Starting limits again' } })),
    'POST /api/plant/units/:unitId/equipment': p('plant.manage', () => ({ path: `/api/plant/units/${f.unitId}/equipment`, body: { kind: 'cw_pump', tag: `M-${f.unique()}`, name: 'Matrix pump' } })),

    'GET /api/units/:unitId/readings': p('signed-in', () => ({ path: `${u}/readings` })),
    'POST /api/units/:unitId/readings': p('reading.record', () => ({ path: `${u}/readings`, body: vacuumRound() })),
    'GET /api/readings/:id': p('signed-in', async () => ({ path: `/api/readings/${await f.remember('round', roundByTrainee)}` })),
    'POST /api/readings/:id/amendments': p('reading.amend', async () => ({ path: `/api/readings/${await f.remember('round', roundByTrainee)}/amendments`, body: { reason: 'Barometer misread', reading: vacuumRound(28.4) } })),
    'POST /api/readings/:id/countersign': p('reading.countersign', async (_w, allowed) => ({ path: `/api/readings/${allowed ? await roundByTrainee() : 1}/countersign` })),

    'GET /api/units/:unitId/flags': p('signed-in', () => ({ path: `${u}/flags` })),
    'POST /api/units/:unitId/flags': p('flag.manage', () => ({ path: `${u}/flags`, body: { parameter: 'subcooling', severity: 'watch', comment: 'Subcooling creeping up' } })),
    'POST /api/flags/:id/assign': p('flag.manage', async (_w, allowed) => {
      const raised = allowed ? await flag() : { id: 1, version: 0 };
      return { path: `/api/flags/${raised.id}/assign`, body: { assignedTo: f.leadA, followUp: 'Check the air ejectors', version: raised.version } };
    }),
    'POST /api/flags/:id/clear': p('flag.manage', async (_w, allowed) => {
      const raised = allowed ? await flag() : { id: 1, version: 0 };
      return { path: `/api/flags/${raised.id}/clear`, body: { comment: 'Back to normal after venting', version: raised.version } };
    }),
    'GET /api/units/:unitId/trends': p('signed-in', () => ({ path: `${u}/trends?parameters=ttd&from=2026-01-01T00:00:00Z&to=${encodeURIComponent(now())}` })),

    'GET /api/units/:unitId/import-mappings': p('import.run', () => ({ path: `${u}/import-mappings` })),
    'POST /api/units/:unitId/imports/inspect': p('import.run', () => ({ path: `${u}/imports/inspect`, file: { buffer: csv, name: 'export.csv' } })),
    'POST /api/units/:unitId/imports/preview': p('import.run', () => ({ path: `${u}/imports/preview`, file: { buffer: csv, name: 'export.csv' }, fields: { mapping } })),
    'POST /api/units/:unitId/imports': p('import.run', () => ({ path: `${u}/imports`, file: { buffer: csv, name: 'export.csv' }, fields: { mapping } })),

    'GET /api/stations/:stationId/settings': p('signed-in', () => ({ path: `/api/stations/${f.stationId}/settings` })),
    'PUT /api/stations/:stationId/settings': p('station.settings', async (_w, allowed) => ({ path: `/api/stations/${f.stationId}/settings`, body: allowed ? await settings() : {} })),

    'GET /api/units/:unitId/log': p('signed-in', () => ({ path: `${u}/log` })),
    'POST /api/units/:unitId/log': p('log.write', () => ({ path: `${u}/log`, body: { position: 'control_room', category: 'operation', text: 'Vented waterbox B', carryToHandover: true } })),
    // Each amends an entry of their own; whose else they may amend is role-rules.test.ts.
    'POST /api/log/:id/amendments': p('log.amend', async (who, allowed) => {
      const id = allowed ? Number((await created(who, `${u}/log`, { position: 'control_room', category: 'operation', text: 'Started 1-CWP-C' })).id) : 1;
      return { path: `/api/log/${id}/amendments`, body: { reason: 'Wrong pump tag', text: 'Started 1-CWP-A' } };
    }),
    'GET /api/units/:unitId/log/shifts': p('signed-in', () => ({ path: `${u}/log/shifts` })),
    'POST /api/units/:unitId/log/reviews': p('log.review', () => ({ path: `${u}/log/reviews`, body: { position: 'control_room', shiftStart: f.shiftStart } })),

    'GET /api/standing-orders': p('signed-in', () => ({ path: `/api/standing-orders?stationId=${f.stationId}` })),
    'POST /api/standing-orders': p('order.issue', () => ({ path: `/api/standing-orders?stationId=${f.stationId}`, body: { title: 'Report TTD', bodyHtml: '<p>Report TTD above 8 K.</p>', effectiveFrom: now() } })),
    'GET /api/standing-orders/:id': p('signed-in', async () => ({ path: `/api/standing-orders/${await order()}` })),
    'POST /api/standing-orders/:id/acknowledge': p('order.acknowledge', async () => ({ path: `/api/standing-orders/${await order()}/acknowledge` })),
    'GET /api/me/pending-orders': p('signed-in', () => ({ path: '/api/me/pending-orders' })),

    'GET /api/units/:unitId/conditions': p('signed-in', () => ({ path: `${u}/conditions` })),
    'POST /api/units/:unitId/conditions': p('condition.manage', () => ({ path: `${u}/conditions`, body: { title: '1-CWP-B out of service', requiredAction: 'Restore within 72 h', startedAt: now(), limitHours: 72, ownerId: f.leadA } })),
    'POST /api/conditions/:id/close': p('condition.manage', async (_w, allowed) => {
      const opened = allowed ? ((await created('shift_lead', `${u}/conditions`, { title: 'Strainer bypassed', requiredAction: 'Restore in 8 h', startedAt: now(), limitHours: 8, ownerId: f.leadA })).condition as { id: number; version: number }) : { id: 1, version: 0 };
      return { path: `/api/conditions/${opened.id}/close`, body: { text: 'Strainer back in service', position: 'control_room', version: opened.version } };
    }),

    'GET /api/units/:unitId/handovers/current': p('signed-in', () => ({ path: `${u}/handovers/current` })),
    'POST /api/units/:unitId/handovers/current': p('handover.take-part', () => ({ path: `${u}/handovers/current`, after: (res) => res.status === 201 && (f.ids.handover ??= Number((res.body.board as { handover: { id: number } }).handover.id)) }), { refused: outgoingOnly }),
    'GET /api/handovers/:id': p('signed-in', async () => ({ path: `/api/handovers/${await handover()}` })),
    'PUT /api/handovers/:id/notes': p('handover.take-part', async (_w, allowed) => ({ path: `/api/handovers/${await handover()}/notes`, body: { html: '<p>Quiet shift.</p>', version: allowed ? (await board()).handover.notesVersion : 0 } }), { refused: outgoingOnly }),
    'POST /api/handovers/:id/items': p('handover.take-part', async () => ({ path: `/api/handovers/${await handover()}/items`, body: { kind: 'equipment', title: '1-CWP-B seal leak' } }), { refused: outgoingOnly }),
    'PATCH /api/handover-items/:id': p('handover.take-part', async (_w, allowed) => {
      const id = allowed ? await newItem() : 1;
      return { path: `/api/handover-items/${id}`, body: { title: 'Seal leak, now dripping', version: 1 } };
    }, { refused: outgoingOnly }),
    'DELETE /api/handover-items/:id': p('handover.take-part', async (_w, allowed) => ({ path: `/api/handover-items/${allowed ? await newItem() : 1}` }), { refused: outgoingOnly }),
    'POST /api/handovers/:id/submit': p('handover.take-part', async () => ({ path: `/api/handovers/${await handover()}/submit` }), { refused: outgoingOnly }),
    'POST /api/handovers/:id/amendments': p('handover.take-part', async () => ({ path: `/api/handovers/${await handover()}/amendments`, body: { reason: 'Tag corrected', text: 'It is 1-CWP-A, not B' } }), { refused: outgoingOnly }),
    'POST /api/handover-items/:id/acknowledge': p('handover.take-part', async () => ({ path: `/api/handover-items/${await firstItem()}/acknowledge` }), { side: 'incoming' }),
    'POST /api/handover-items/:id/queries': p('handover.take-part', async () => ({ path: `/api/handover-items/${await firstItem()}/queries`, body: { question: 'Which pump is on standby?' } }), { side: 'incoming' }),
    'POST /api/handover-queries/:id/answer': p('handover.take-part', async (_w, allowed) => ({ path: `/api/handover-queries/${allowed ? await question() : 1}/answer`, body: { answer: 'Pump C' } }), { refused: { trainee: 'a trainee does not answer for the outgoing crew' } }),
    'POST /api/handovers/:id/accept': p('handover.take-part', async (_w, allowed) => {
      if (allowed) await readyToAccept();
      return { path: `/api/handovers/${await handover()}/accept` };
    }, { side: 'incoming', refused: leadOnly }),
    'POST /api/handover-items/:id/attachments': p('handover.attach', async (_w, allowed) => ({
      path: `/api/handover-items/${allowed ? await firstItem() : 1}/attachments`,
      file: { buffer: png, name: 'gauge.png' },
      fields: { reason: 'Photo of the gauge' },
      after: (res) => res.status === 201 && (f.ids.attachment ??= Number(res.body.id)),
    })),
    'GET /api/attachments/:id': p('signed-in', async () => ({ path: `/api/attachments/${await attachment()}` })),

    'PUT /api/stations/:stationId/crew-rotation': p('shifts.manage', () => ({ path: `/api/stations/${f.stationId}/crew-rotation`, body: { anchorShiftStart: f.shiftStart, crewIds: [f.crewA, f.crewB] } })),
    'POST /api/stations/:stationId/crew-swaps': p('shifts.manage', () => ({ path: `/api/stations/${f.stationId}/crew-swaps`, body: { shiftStart: f.laterShiftStart, crewId: f.crewA, reason: 'Crew on a course' } })),

    'GET /api/logbook/search': p('signed-in', () => ({ path: `/api/logbook/search?q=waterbox&unitId=${f.unitId}` })),
    'GET /api/logbook/search.csv': p('signed-in', () => ({ path: `/api/logbook/search.csv?q=waterbox&unitId=${f.unitId}` })),
    'GET /api/logbook/units/:unitId/shifts/:shiftStart': p('signed-in', () => ({ path: `/api/logbook/units/${f.unitId}/shifts/${f.shiftStart}` })),
    'POST /api/logbook/review-comments': p('review.comment', async (_w, allowed) => ({ path: '/api/logbook/review-comments', body: { documentId: allowed ? await logDocument() : 1, body: 'Say which strainer next time.' } })),
    'GET /api/logbook/review-comments/mine': p('signed-in', () => ({ path: '/api/logbook/review-comments/mine' })),

    'GET /api/training/tasks': p('signed-in', () => ({ path: '/api/training/tasks' })),
    'GET /api/training/tasks/:taskKey/versions': p('signed-in', async () => ({ path: `/api/training/tasks/${await sharedTask()}/versions` })),
    'POST /api/training/tasks': p('training.catalogue', () => ({ path: '/api/training/tasks', body: { ...task, taskKey: taskKey() } })),
    'PUT /api/training/tasks/:taskKey': p('training.catalogue', async (_w, allowed) => ({ path: `/api/training/tasks/${allowed ? await newTask() : 'AM-1'}`, body: { ...task, requiredPerformances: 2, changeNote: 'Twice now' } })),
    'POST /api/training/tasks/:taskKey/retire': p('training.catalogue', async (_w, allowed) => ({ path: `/api/training/tasks/${allowed ? await newTask() : 'AM-1'}/retire`, body: { changeNote: 'Pump replaced' } })),
    'POST /api/training/entries': p('training.practice', async () => ({ path: '/api/training/entries', body: { taskKey: await sharedTask(), performedOn: now().slice(0, 10), level: 'observed', note: 'Watched the start' } })),
    'POST /api/training/entries/:id/countersign': p('training.countersign', async (_w, allowed) => ({ path: `/api/training/entries/${allowed ? await traineeEntry() : 1}/countersign` })),
    'POST /api/training/entries/:id/reject': p('training.countersign', async (_w, allowed) => ({ path: `/api/training/entries/${allowed ? await traineeEntry() : 1}/reject`, body: { reason: 'Not on this shift' } })),
    'POST /api/training/decisions': p('training.decide', async () => ({ path: '/api/training/decisions', body: { traineeId: f.traineeA, taskKey: await sharedTask(), decision: 'returned', comments: 'Practise the valve sequence once more' } })),
    'POST /api/training/amendments': p('training.amend', async (_w, allowed) => ({ path: '/api/training/amendments', body: { target: 'entry', targetId: allowed ? await traineeEntry() : 1, reason: 'Wrong date noted', text: 'It was the day before' } })),
    'GET /api/training/me': p('training.practice', () => ({ path: '/api/training/me' })),
    'GET /api/training/trainees/:id': p('signed-in', () => ({ path: `/api/training/trainees/${f.traineeA}` }), { refused: { operator: 'an operator reads only their own training record' } }),
    'GET /api/training/countersign-queue': p('training.countersign', () => ({ path: '/api/training/countersign-queue' })),
    'GET /api/training/review-queue': p('training.review-queue', () => ({ path: '/api/training/review-queue' })),
    'GET /api/training/crews/:crewId': p('training.crews', () => ({ path: `/api/training/crews/${f.crewA}` })),

    'GET /api/units/:unitId/shift-condenser': p('signed-in', () => ({ path: `${u}/shift-condenser` })),
    'GET /api/handovers/:id/header': p('signed-in', async () => ({ path: `/api/handovers/${await handover()}/header` })),
    'GET /api/overview': p('signed-in', () => ({ path: '/api/overview' })),
    'POST /api/calc/condenser': p('signed-in', () => ({ path: '/api/calc/condenser', body: { unitId: f.unitId, ...vacuumRound() } })),
    'GET /api/calc/units/:unitId/condenser-design': p('signed-in', () => ({ path: `/api/calc/units/${f.unitId}/condenser-design` })),
  };
}
