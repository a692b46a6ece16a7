declare module 'psychrolib' {
  const psychrolib: {
    SI: number;
    IP: number;
    SetUnitSystem(system: number): void;
    GetTWetBulbFromRelHum(tDryBulb: number, relHum: number, pressure: number): number;
    GetTWetBulbFromHumRatio(tDryBulb: number, humRatio: number, pressure: number): number;
    GetSatVapPres(tDryBulb: number): number;
    GetRelHumFromHumRatio(tDryBulb: number, humRatio: number, pressure: number): number;
  };
  export default psychrolib;
}
