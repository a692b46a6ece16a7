// The fictional demo scenario: Fernhollow Station, an invented two-unit plant.
// Every name, tag and figure here is made up for the demo.
import type { EquipmentKind } from '../../features/plant/model';
import type { TubeMaterial } from '../../../shared/calc/hei';
import { startingLimits, type LimitSet } from '../../../shared/calc/limits';

export const demoStation = { code: 'FHS', name: 'Fernhollow Station' };
export const demoCrews = ['A', 'B', 'C', 'D'];

type DemoUnit = {
  code: string;
  name: string;
  equipment: { kind: EquipmentKind; tag: string; name: string }[];
  designNote: string;
  /** Limit changes after the first set, dated in days before the seed's "now". */
  limitRevisions: { daysAgo: number; limits: LimitSet; note: string }[];
};

const unitEquipment = (n: number): DemoUnit['equipment'] => [
  { kind: 'condenser', tag: `${n}-CND-01`, name: `Unit ${n} main condenser (two shells)` },
  { kind: 'cw_pump', tag: `${n}-CWP-A`, name: `Unit ${n} circulating-water pump A` },
  { kind: 'cw_pump', tag: `${n}-CWP-B`, name: `Unit ${n} circulating-water pump B` },
  { kind: 'cooling_tower', tag: `${n}-CT-01`, name: `Unit ${n} mechanical-draft cooling tower` },
  { kind: 'air_removal', tag: `${n}-VP-A`, name: `Unit ${n} liquid-ring vacuum pump A` },
  { kind: 'air_removal', tag: `${n}-VP-B`, name: `Unit ${n} liquid-ring vacuum pump B` },
];

/** Days before the rounds history starts that the units came back on load with their data sheets. */
export const demoReturnToServiceDaysBeforeHistory = 9;
export const demoFirstLimitsNote = 'Starting limits (common practice) for the return to service; review after two weeks on load';

export const demoUnits: DemoUnit[] = [
  {
    code: 'U1',
    name: 'Unit 1',
    equipment: unitEquipment(1),
    designNote: 'Condenser data sheet FH-DS-1-CND rev. C, as built after the titanium retubing outage',
    limitRevisions: [
      {
        daysAgo: 5,
        limits: { ...startingLimits, dissolvedOxygen: { highWatch: 15, highAlarm: 40 } },
        note: 'Two-week review: dissolved-oxygen watch lowered from 20 to 15 ppb now the LP gland leak is repaired (WO 24-0817), to catch a return of air in-leakage early. Alarm stays at 40 ppb; other limits unchanged.',
      },
    ],
  },
  {
    code: 'U2',
    name: 'Unit 2',
    equipment: unitEquipment(2),
    designNote: 'Condenser data sheet FH-DS-2-CND rev. B, acceptance-test values confirmed at the return to service',
    limitRevisions: [],
  },
];

/**
 * Invented condenser design data, SI. Chosen to be self-consistent: at design flow (15 000 kg/s),
 * inlet (22 °C) and duty (560 MW) the HEI clean U × 0.90 gives 5.53 kPa a by the NTU method.
 */
export const demoCondenserDesign = {
  surfaceAreaM2: 30_000,
  tubeOdMm: 25.4,
  tubeGaugeBwg: 22,
  tubeMaterial: 'titanium' as TubeMaterial,
  tubeCount: 19_800,
  passes: 1,
  designCwFlowKgS: 15_000,
  designCwInletK: 273.15 + 22,
  designDutyW: 560e6,
  designBackpressurePa: 5_530,
  designCleanliness: 0.9,
  designCleanUWM2K: null,
  // backpressure (Pa) → MW lost against the design point (invented curve for the demo)
  backpressureCorrection: [
    [3_000, -1.5],
    [4_000, -0.9],
    [5_530, 0],
    [7_000, 1.6],
    [9_000, 4.2],
    [12_000, 8.5],
    [16_000, 15.1],
  ] as [number, number][],
  energyPricePerMwh: 85,
  currency: 'EUR',
  towerDesignRangeK: 9,
  towerDesignApproachK: 6,
  towerDesignWetBulbK: 273.15 + 19,
};
