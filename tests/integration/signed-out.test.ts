import { afterAll, describe, expect, it } from 'vitest';
import { anonymousAgent, buildApp, closeAll } from './support/test-app';

afterAll(closeAll);
const built = buildApp();

// Every API route except sign-in, the CSRF token and the health and readiness probes needs a session.
const routes: [method: 'get' | 'post' | 'patch' | 'put', path: string][] = [
  ['get', '/api/me'],
  ['get', '/api/overview'],
  ['post', '/api/me/password'],
  ['get', '/api/plant/crews'],
  ['get', '/api/plant/units'],
  ['get', '/api/plant/people'],
  ['get', '/api/plant/units/1/setup'],
  ['post', '/api/plant/units/1/design-versions'],
  ['post', '/api/plant/units/1/limit-versions'],
  ['post', '/api/plant/units/1/plausible-range-versions'],
  ['post', '/api/plant/units/1/equipment'],
  ['post', '/api/calc/condenser'],
  ['get', '/api/calc/units/1/condenser-design'],
  ['get', '/api/units/1/readings'],
  ['post', '/api/units/1/readings'],
  ['get', '/api/readings/1'],
  ['post', '/api/readings/1/amendments'],
  ['post', '/api/readings/1/countersign'],
  ['get', '/api/units/1/flags'],
  ['post', '/api/units/1/flags'],
  ['post', '/api/flags/1/assign'],
  ['post', '/api/flags/1/clear'],
  ['get', '/api/units/1/trends?parameters=ttd&from=2026-01-01T00:00:00Z&to=2026-02-01T00:00:00Z'],
  ['get', '/api/units/1/import-mappings'],
  ['post', '/api/units/1/imports/inspect'],
  ['post', '/api/units/1/imports/preview'],
  ['post', '/api/units/1/imports'],
  ['get', '/api/stations/1/settings'],
  ['get', '/api/units/1/log'],
  ['post', '/api/units/1/log'],
  ['post', '/api/log/1/amendments'],
  ['get', '/api/units/1/log/shifts'],
  ['post', '/api/units/1/log/reviews'],
  ['get', '/api/standing-orders'],
  ['post', '/api/standing-orders'],
  ['get', '/api/standing-orders/1'],
  ['post', '/api/standing-orders/1/acknowledge'],
  ['get', '/api/me/pending-orders'],
  ['get', '/api/units/1/conditions'],
  ['post', '/api/units/1/conditions'],
  ['post', '/api/conditions/1/close'],
  ['get', '/api/units/1/handovers/current'],
  ['get', '/api/handovers/1'],
  ['get', '/api/handovers/1/header'],
  ['get', '/api/units/1/shift-condenser'],
  ['post', '/api/handovers/1/items'],
  ['post', '/api/handovers/1/submit'],
  ['post', '/api/handovers/1/amendments'],
  ['post', '/api/handovers/1/accept'],
  ['post', '/api/handover-items/1/acknowledge'],
  ['post', '/api/handover-items/1/queries'],
  ['post', '/api/handover-queries/1/answer'],
  ['post', '/api/handover-items/1/attachments'],
  ['get', '/api/attachments/1'],
  ['post', '/api/stations/1/crew-swaps'],
  ['get', '/api/admin/users'],
  ['get', '/api/admin/audit-events'],
  ['put', '/api/handovers/1/notes'],
  ['put', '/api/stations/1/settings'],
  ['put', '/api/stations/1/crew-rotation'],
];

describe('signed out', () => {
  it.each(routes)('%s %s answers 401 with a JSON error', async (method, path) => {
    const agent = await anonymousAgent(built);
    const res = await agent[method](path).set('X-CSRF-Token', agent.csrf).send({});
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });
});
