import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { AuditEvent } from '../../server/features/audit/model';
import { UnitDesignVersion } from '../../server/features/plant/model';
import type { Role } from '../../shared/roles';
import { anonymousAgent, buildApp, closeAll, handBuiltDesign, makeUnit, makeUser, signedInAgent } from './support/test-app';

afterAll(closeAll);
const built = buildApp();
let unitId = 0;
beforeAll(async () => {
  unitId = (await makeUnit()).id;
});

describe('plant setup', () => {
  it('lets every signed-in role read the setup, and answers 401 signed out', async () => {
    await (await anonymousAgent(built)).get(`/api/plant/units/${unitId}/setup`).expect(401);
    const agent = await signedInAgent(built, (await makeUser('trainee')).email);
    const res = await agent.get(`/api/plant/units/${unitId}/setup`).expect(200);
    expect(res.body.design.data.surfaceAreaM2).toBe(17_500);
    expect(res.body.limits.data.backpressure).toBeDefined();
    expect(res.body.designHistory).toHaveLength(1);
  });

  it.each<Role>(['trainee', 'operator', 'shift_lead', 'trainer'])('answers 403 to a %s changing design, limits or equipment', async (role) => {
    const agent = await signedInAgent(built, (await makeUser(role)).email);
    await agent.post(`/api/plant/units/${unitId}/design-versions`).set('X-CSRF-Token', agent.csrf).send({ design: handBuiltDesign, note: 'x' }).expect(403);
    await agent.post(`/api/plant/units/${unitId}/limit-versions`).set('X-CSRF-Token', agent.csrf).send({ limits: {}, note: 'x' }).expect(403);
    await agent.post(`/api/plant/units/${unitId}/equipment`).set('X-CSRF-Token', agent.csrf).send({ kind: 'cw_pump', tag: 'X', name: 'X' }).expect(403);
  });

  it('keeps every design version and who made it; the newest is in force', async () => {
    const admin = await makeUser('admin');
    const agent = await signedInAgent(built, admin.email);
    const res = await agent
      .post(`/api/plant/units/${unitId}/design-versions`)
      .set('X-CSRF-Token', agent.csrf)
      .send({ design: { ...handBuiltDesign, surfaceAreaM2: 18_000 }, note: 'Area corrected from the as-built drawing' });
    expect(res.status).toBe(201);
    const setup = await agent.get(`/api/plant/units/${unitId}/setup`).expect(200);
    expect(setup.body.design.data.surfaceAreaM2).toBe(18_000);
    expect(setup.body.designHistory[0]).toMatchObject({ note: 'Area corrected from the as-built drawing', by: admin.name });
    expect(await UnitDesignVersion.count({ where: { unitId } })).toBe(2);
    expect(await AuditEvent.count({ where: { action: 'unit_design.new_version', entityId: String(unitId) } })).toBe(1);
  });

  it('answers 400 with field messages for bad design data, limits and equipment', async () => {
    const agent = await signedInAgent(built, (await makeUser('admin')).email);
    const design = await agent
      .post(`/api/plant/units/${unitId}/design-versions`)
      .set('X-CSRF-Token', agent.csrf)
      .send({ design: { ...handBuiltDesign, surfaceAreaM2: -5, tubeGaugeBwg: 23, backpressureCorrection: [[8000, 0], [4000, 1]] }, note: '' });
    expect(design.status).toBe(400);
    expect(Object.keys(design.body.error.fields)).toEqual(expect.arrayContaining(['design.surfaceAreaM2', 'design.tubeGaugeBwg', 'design.backpressureCorrection', 'note']));
    const limits = await agent
      .post(`/api/plant/units/${unitId}/limit-versions`)
      .set('X-CSRF-Token', agent.csrf)
      .send({ limits: { ttd: { highWatch: 8, highAlarm: 5 } }, note: 'swap' });
    expect(limits.status).toBe(400);
    expect(limits.body.error.fields['limits.ttd.highAlarm']).toMatch(/at or above high watch/);
    const equipment = await agent.post(`/api/plant/units/${unitId}/equipment`).set('X-CSRF-Token', agent.csrf).send({ kind: 'spaceship', tag: '<b>', name: '' });
    expect(equipment.status).toBe(400);
    expect(Object.keys(equipment.body.error.fields).sort()).toEqual(['kind', 'name', 'tag']);
  });

  it('adds equipment once per tag', async () => {
    const agent = await signedInAgent(built, (await makeUser('admin')).email);
    await agent.post(`/api/plant/units/${unitId}/equipment`).set('X-CSRF-Token', agent.csrf).send({ kind: 'cw_pump', tag: 'T-CWP-C', name: 'Spare CW pump C' }).expect(201);
    const again = await agent.post(`/api/plant/units/${unitId}/equipment`).set('X-CSRF-Token', agent.csrf).send({ kind: 'cw_pump', tag: 'T-CWP-C', name: 'Spare CW pump C' });
    expect(again.status).toBe(400);
    expect(again.body.error.fields.tag).toMatch(/already/);
  });
});
