// Two weeks of invented hourly rounds for the demo, so trends and flags have something to show.
// Unit 1's tubes foul slowly (cleanliness 0.90 → 0.72); Unit 2 stays clean. Deterministic.
import type { Sequelize } from 'sequelize';
import { expectedBackpressure } from '../../../shared/calc/backpressure';
import type { UnitDesign } from '../../../shared/schemas/plant';
import { cleanUHei, tubeVelocity } from '../../../shared/calc/hei';
import { WATER_CP, waterDensity } from '../../../shared/calc/water';
import type { ReadingSetInput } from '../../../shared/schemas/reading-set';
import { convertReadingSet } from '../../lib/convert-readings';
import { ReadingCountersign, ReadingSet } from '../../features/readings/model';
import { storeReading } from '../../features/readings/service';
import type { DemoRoster } from './demo-roster';

const HOURS = 14 * 24;

/** The hourly rounds cover the fourteen days up to the last full hour before `now`. */
export function demoHistoryWindow(now: Date) {
  const end = new Date(now);
  end.setUTCMinutes(0, 0, 0);
  return { start: new Date(end.getTime() - HOURS * 3_600_000), end };
}

function random(seed: number) {
  let state = seed;
  return () => {
    state = (state * 1_103_515_245 + 12_345) % 2_147_483_648;
    return state / 2_147_483_648;
  };
}

export function demoRound(design: UnitDesign, hour: number, fouling: boolean, next: () => number): ReadingSetInput & { takenAtOffsetH: number } {
  const inletC = 20.5 + 2.5 * Math.sin((2 * Math.PI * (hour - 9)) / 24) + (next() - 0.5) * 0.4;
  const flowKgS = design.designCwFlowKgS * (0.97 + next() * 0.04);
  const dutyW = design.designDutyW * (0.85 + 0.12 * Math.sin((2 * Math.PI * hour) / 24 + 1) + next() * 0.03);
  const cleanliness = fouling ? 0.9 - (0.18 * hour) / HOURS : 0.9 - next() * 0.02;
  const inletK = inletC + 273.15;
  const velocity = tubeVelocity({ tubeOdMm: design.tubeOdMm, gaugeBwg: design.tubeGaugeBwg, tubeCount: design.tubeCount, passes: design.passes }, flowKgS, waterDensity(inletK));
  const u = cleanUHei({ tubeOdMm: design.tubeOdMm, gaugeBwg: design.tubeGaugeBwg, material: design.tubeMaterial, velocityMS: velocity, inletK }) * cleanliness;
  const expected = expectedBackpressure({ uWM2K: u, surfaceAreaM2: design.surfaceAreaM2, cwFlowKgS: flowKgS, cwInletK: inletK, dutyW });
  const riseK = dutyW / (flowKgS * WATER_CP);
  const round1 = (v: number, d = 1) => Math.round(v * 10 ** d) / 10 ** d;
  return {
    takenAtOffsetH: hour,
    unitId: 0,
    pressure: { value: round1(expected.pressurePa / 1000, 2), unit: 'kPa_a' },
    hotwellTemperature: { value: round1(expected.saturationK - 273.15 - 0.3 - next() * 0.4), unit: 'degC' },
    cwInletTemperature: { value: round1(inletC), unit: 'degC' },
    cwOutletTemperature: { value: round1(inletC + riseK), unit: 'degC' },
    cwFlow: { value: Math.round((flowKgS / waterDensity(inletK)) * 3600), unit: 'm3_h' },
    dissolvedOxygenPpb: round1(6 + next() * 4),
    tower: {
      coldWaterTemperature: { value: round1(inletC), unit: 'degC' },
      // Air a little cooler than the basin and fairly humid: the approach stays near the tower's 6 K
      // design (2.4–6.9 K), inside its plausible range and below the watch limit.
      dryBulbTemperature: { value: round1(inletC - 1 + next() * 2), unit: 'degC' },
      relativeHumidityPercent: Math.round(55 + next() * 15),
      makeupConductivity: { value: 420, unit: 'uS_cm' },
      basinConductivity: { value: Math.round(2000 + next() * 200), unit: 'uS_cm' },
      targetCycles: 5,
    },
  };
}

export async function seedDemoHistory(
  sequelize: Sequelize,
  units: { id: number; design: UnitDesign; fouling: boolean }[],
  roster: DemoRoster,
  now: Date,
): Promise<number> {
  let stored = 0;
  const { start } = demoHistoryWindow(now);
  for (const [unitIndex, unit] of units.entries()) {
    if (await ReadingSet.count({ where: { unitId: unit.id } })) continue;
    const next = random(unit.id * 7919);
    await sequelize.transaction(async (transaction) => {
      for (let hour = 0; hour < HOURS; hour++) {
        const { takenAtOffsetH, ...round } = demoRound(unit.design, hour, unit.fouling, next);
        const raw = { ...round, unitId: unit.id };
        const takenAt = new Date(start.getTime() + takenAtOffsetH * 3_600_000);
        const by = roster.roundBy(takenAt, unitIndex);
        // Written up a few minutes after the walk, countersigned before the next round.
        const recordedAt = new Date(takenAt.getTime() + (4 + (hour % 5)) * 60_000);
        const { reading } = await storeReading(
          // Nothing confirmed: the invented history must stay inside the starting plausible ranges.
          { unitId: unit.id, takenAt, recordedAt, raw, si: convertReadingSet(raw), actor: by.recorder, source: 'round', importKey: null, confirmed: [] },
          transaction,
        );
        stored += 1;
        if (by.countersigner) {
          await ReadingCountersign.create({ readingSetId: reading.id, signedBy: by.countersigner.id, signedAt: new Date(recordedAt.getTime() + 15 * 60_000) }, { transaction });
          stored += 1;
        }
      }
    });
  }
  return stored;
}
