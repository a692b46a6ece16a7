// An invented last shift for the demo log: a few entries, a standing order and a condition.
import type { Sequelize } from 'sequelize';
import { shiftStartFor } from '../../../shared/shift-time';
import { defaultStationSettings } from '../../features/stations/settings';
import { StationSettingsRow } from '../../features/stations/model';
import { LogEntry } from '../../features/log/model';
import { StandingOrder } from '../../features/standing-orders/model';
import { Condition } from '../../features/conditions/model';
import { Crew, Equipment } from '../../features/plant/model';
import { User } from '../../features/users/model';

export async function seedDemoLog(sequelize: Sequelize, stationId: number, unitId: number): Promise<number> {
  let created = 0;
  await sequelize.transaction(async (transaction) => {
    // Crews A, B, C, D take the shifts in turn, crew A from the shift in progress at first start.
    const crews = await Crew.findAll({ where: { stationId }, order: [['name', 'ASC']], transaction });
    const anchor = shiftStartFor(new Date(), defaultStationSettings.timeZone, defaultStationSettings.shiftChangeTimes);
    const [, madeSettings] = await StationSettingsRow.findOrCreate({
      where: { stationId },
      defaults: { stationId, ...defaultStationSettings, crewRotation: { anchorShiftStart: anchor.toISOString(), crewIds: crews.map((c) => c.id) }, updatedAt: new Date() },
      transaction,
    });
    created += Number(madeSettings);
    if (await LogEntry.count({ where: { unitId }, transaction })) return;
    const person = async (email: string) => (await User.findOne({ where: { email }, transaction }))!;
    const operator = await person('operator.a@fernhollow.example');
    const field = await person('operator.b@fernhollow.example');
    const lead = await person('lead.a@fernhollow.example');
    const trainee = await person('trainee.a@fernhollow.example');
    const pumpB = await Equipment.findOne({ where: { unitId, tag: '1-CWP-B' }, transaction });
    const settings = defaultStationSettings;
    const now = Date.now();
    const entry = (minutesAgo: number, authorId: number, position: string, category: string, text: string, extra: Partial<{ equipmentId: number | null; carryToHandover: boolean }> = {}) => {
      const eventAt = new Date(now - minutesAgo * 60_000);
      return LogEntry.create(
        {
          unitId,
          position,
          category,
          eventAt,
          enteredAt: eventAt,
          shiftStart: shiftStartFor(eventAt, settings.timeZone, settings.shiftChangeTimes),
          late: false,
          authorId,
          text,
          equipmentId: extra.equipmentId ?? null,
          readingSetId: null,
          flagId: null,
          conditionId: null,
          carryToHandover: extra.carryToHandover ?? false,
        },
        { transaction },
      );
    };
    // Three days back, on an earlier shift: something for the logbook history and a trainer's review.
    await entry(3 * 24 * 60 + 120, trainee.id, 'field_cw_tower', 'alarm_abnormal', 'Hotwell level creeping up on Unit 1 during the round; told the control room. Level controller found in manual, put back to auto by the operator.');
    await entry(300, operator.id, 'control_room', 'communication', 'Took the shift from crew D; walked down the condenser panel with the outgoing operator.');
    await entry(240, field.id, 'field_cw_tower', 'equipment_status', 'Isolated 1-CWP-B for seal replacement under permit WP-1187; 1-CWP-A carrying the load.', { equipmentId: pumpB?.id ?? null, carryToHandover: true });
    await entry(180, operator.id, 'control_room', 'alarm_abnormal', 'Backpressure 5.3 kPa a, 0.5 kPa above expected; cleanliness trending down. Informed the shift lead.', { carryToHandover: true });
    await entry(90, field.id, 'field_cw_tower', 'operation', 'Backwashed Unit 1 waterbox A; screen ΔP back to normal.');
    created += 5;
    await StandingOrder.create(
      {
        stationId,
        title: 'Unit 1: hourly TTD while cleanliness is below 0.75',
        bodyHtml: '<p>Until the tubes are cleaned, record <strong>TTD every hour</strong> on the Unit 1 round and tell the shift lead if it passes 9 K.</p>',
        bodyText: 'Until the tubes are cleaned, record TTD every hour on the Unit 1 round and tell the shift lead if it passes 9 K.',
        effectiveFrom: new Date(now - 2 * 86_400_000),
        effectiveTo: new Date(now + 12 * 86_400_000),
        crewIds: [],
        positions: ['control_room'],
        issuedBy: lead.id,
        issuedAt: new Date(now - 2 * 86_400_000),
      },
      { transaction },
    );
    await Condition.create(
      {
        unitId,
        title: '1-CWP-B out of service (seal replacement)',
        requiredAction: 'Restore 1-CWP-B to service within 72 h, or reduce Unit 1 load per the operating procedure.',
        startedAt: new Date(now - 4 * 3_600_000),
        limitAt: new Date(now + 68 * 3_600_000),
        ownerId: lead.id,
        openedBy: field.id,
        openedAt: new Date(now - 4 * 3_600_000),
        closedBy: null,
        closedAt: null,
        closingEntryId: null,
      },
      { transaction },
    );
    created += 2;
  });
  return created;
}
