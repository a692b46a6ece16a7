// Every computed check: its label, its SI unit and what kind of quantity it is (for display).
export type Quantity =
  | 'temperature'
  | 'temperature_difference'
  | 'pressure'
  | 'pressure_difference'
  | 'power'
  | 'heat_transfer_coefficient'
  | 'velocity'
  | 'ratio'
  | 'mass_flow'
  | 'index'
  | 'money_rate'
  | 'concentration_ppb';

export const siUnitOf: Record<Quantity, string> = {
  temperature: 'K',
  temperature_difference: 'K',
  pressure: 'Pa',
  pressure_difference: 'Pa',
  power: 'W',
  heat_transfer_coefficient: 'W/(m²·K)',
  velocity: 'm/s',
  ratio: '1',
  mass_flow: 'kg/s',
  index: '1',
  money_rate: 'per h',
  concentration_ppb: 'µg/kg',
};

export const checkCatalog = {
  backpressure: { label: 'Condenser absolute pressure', quantity: 'pressure' },
  hotwellTemperature: { label: 'Hotwell temperature', quantity: 'temperature' },
  cwInletTemperature: { label: 'CW inlet temperature', quantity: 'temperature' },
  cwOutletTemperature: { label: 'CW outlet temperature', quantity: 'temperature' },
  cwFlow: { label: 'CW flow', quantity: 'mass_flow' },
  saturationTemperature: { label: 'Saturation temperature', quantity: 'temperature' },
  subcooling: { label: 'Condensate subcooling', quantity: 'temperature_difference' },
  ttd: { label: 'Terminal temperature difference (TTD)', quantity: 'temperature_difference' },
  itd: { label: 'Initial temperature difference (ITD)', quantity: 'temperature_difference' },
  cwRise: { label: 'CW temperature rise', quantity: 'temperature_difference' },
  lmtd: { label: 'Log-mean temperature difference (LMTD)', quantity: 'temperature_difference' },
  duty: { label: 'Heat duty', quantity: 'power' },
  overallU: { label: 'Overall heat-transfer coefficient U', quantity: 'heat_transfer_coefficient' },
  tubeVelocity: { label: 'Tube water velocity', quantity: 'velocity' },
  cleanU: { label: 'Clean U (HEI)', quantity: 'heat_transfer_coefficient' },
  cleanlinessFactor: { label: 'Cleanliness factor', quantity: 'ratio' },
  expectedBackpressure: { label: 'Expected backpressure', quantity: 'pressure' },
  backpressureDeviation: { label: 'Backpressure deviation (actual − expected)', quantity: 'pressure_difference' },
  deviationCostPower: { label: 'Output lost to the deviation', quantity: 'power' },
  deviationCostMoney: { label: 'Cost of the deviation', quantity: 'money_rate' },
  dissolvedOxygen: { label: 'Condensate dissolved oxygen', quantity: 'concentration_ppb' },
  airRemovalFlow: { label: 'Air-removal flow', quantity: 'mass_flow' },
  basinTemperature: { label: 'Cooling-tower basin temperature', quantity: 'temperature' },
  wetBulb: { label: 'Wet-bulb temperature', quantity: 'temperature' },
  towerRange: { label: 'Cooling-tower range', quantity: 'temperature_difference' },
  towerApproach: { label: 'Cooling-tower approach', quantity: 'temperature_difference' },
  towerEffectiveness: { label: 'Cooling-tower effectiveness', quantity: 'ratio' },
  evaporation: { label: 'Evaporation (estimate)', quantity: 'mass_flow' },
  cycles: { label: 'Cycles of concentration', quantity: 'ratio' },
  blowdownNeeded: { label: 'Blowdown for target cycles', quantity: 'mass_flow' },
  makeupNeeded: { label: 'Makeup for target cycles', quantity: 'mass_flow' },
  langelier: { label: 'Langelier Saturation Index', quantity: 'index' },
  ryznar: { label: 'Ryznar Stability Index', quantity: 'index' },
} as const satisfies Record<string, { label: string; quantity: Quantity }>;

export type CheckKey = keyof typeof checkCatalog;
export const checkKeys = Object.keys(checkCatalog) as CheckKey[];
