declare module "psychrolib" {
  const psychrolib: {
    SI: number;
    IP: number;
    SetUnitSystem(units: number): void;
    GetUnitSystem(): number;
    GetStandardAtmPressure(altitudeM: number): number;
    GetStandardAtmTemperature(altitudeM: number): number;
    GetHumRatioFromRelHum(tDryBulb: number, relHum: number, pressure: number): number;
    GetHumRatioFromTWetBulb(tDryBulb: number, tWetBulb: number, pressure: number): number;
    GetRelHumFromHumRatio(tDryBulb: number, humRatio: number, pressure: number): number;
    GetTWetBulbFromRelHum(tDryBulb: number, relHum: number, pressure: number): number;
    GetRelHumFromTWetBulb(tDryBulb: number, tWetBulb: number, pressure: number): number;
    GetRelHumFromTDewPoint(tDryBulb: number, tDewPoint: number): number;
    GetMoistAirEnthalpy(tDryBulb: number, humRatio: number): number;
    GetMoistAirDensity(tDryBulb: number, humRatio: number, pressure: number): number;
    GetMoistAirVolume(tDryBulb: number, humRatio: number, pressure: number): number;
    GetSatVapPres(tDryBulb: number): number;
    GetSatHumRatio(tDryBulb: number, pressure: number): number;
    GetTDewPointFromHumRatio(tDryBulb: number, humRatio: number, pressure: number): number;
    GetVapPresFromHumRatio(humRatio: number, pressure: number): number;
    CalcPsychrometricsFromRelHum(
      tDryBulb: number,
      relHum: number,
      pressure: number,
    ): [number, number, number, number, number, number, number];
    [name: string]: unknown;
  };
  export default psychrolib;
}
