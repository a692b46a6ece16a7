// A round as the form sends it: condenser vacuum against a 29.92 inHg barometer, CW at 18 → 26.5 °C.
// 28.5 inHg vacuum = 1.42 inHgA = 4.81 kPa a (1 inHg at 32 °F = 3.386389 kPa, NIST SP 811).
export const vacuumRound = (vacuumInHg = 28.5, hotwellC = 31.5) => ({
  pressure: { value: vacuumInHg, unit: 'inHg_vac' },
  barometer: { value: 29.92, unit: 'inHgA' },
  hotwellTemperature: { value: hotwellC, unit: 'degC' },
  cwInletTemperature: { value: 18, unit: 'degC' },
  cwOutletTemperature: { value: 26.5, unit: 'degC' },
  cwFlow: { value: 54_000, unit: 'm3_h' },
});
