// `npm run bench:calc`: how long one reading set's full evaluation takes, and saturationTemperature alone.
// Figures are machine-dependent; they are reported, not asserted.
import { evaluateReadingSet, type CondenserDesignSi, type ReadingSetSi } from '../shared/calc/evaluate';
import { startingLimits } from '../shared/calc/limits';
import { startingPlausibleRanges } from '../shared/calc/plausibility';
import { saturationTemperature } from '../shared/calc/saturation';
import { demoCondenserDesign } from '../server/db/seed/demo-plant';

const iterations = Number(process.env.BENCH_ITERATIONS ?? 1_000_000);
const design: CondenserDesignSi = demoCondenserDesign;

// A full round: condenser, tower with psychrometric wet bulb, cycles and chemistry.
const reading = (i: number): ReadingSetSi => ({
  pressurePa: 6000 + (i % 2000),
  hotwellK: 308.9,
  cwInletK: 295.15,
  cwOutletK: 304.1,
  cwFlowKgS: 15_000,
  dissolvedOxygenPpb: 9,
  tower: { coldWaterK: 295.15, dryBulbK: 300.15, relativeHumidity: 0.55, stationPressurePa: 100_500, makeupConductivity: 0.04, towerConductivity: 0.18, targetCycles: 5 },
  chemistry: { pH: 8.1, temperatureK: 303.15, totalDissolvedSolids: 1100, calciumHardness: 380, totalAlkalinity: 140 },
});

function time(label: string, n: number, body: (i: number) => number) {
  let sink = 0;
  for (let i = 0; i < Math.min(n, 20_000); i++) sink += body(i); // warm-up for the JIT
  const start = process.hrtime.bigint();
  for (let i = 0; i < n; i++) sink += body(i);
  const ns = Number(process.hrtime.bigint() - start) / n;
  console.log(`${label}: ${ns.toFixed(1)} ns per evaluation (${n.toLocaleString('en-GB')} runs; checksum ${sink.toExponential(3)})`);
}

const readings = Array.from({ length: 2000 }, (_, i) => reading(i));
time('full reading set (every check + hints)', iterations, (i) => {
  const result = evaluateReadingSet(readings[i % 2000]!, design, startingLimits, startingPlausibleRanges);
  return result.checks.expectedBackpressure.value ?? 0;
});
time('saturationTemperature alone', iterations, (i) => saturationTemperature(3000 + (i % 10_000)));
