// psychrolib ships no types; these are the calls Spoolbook makes (SI: °C, Pa, kg/kg, kg/m³).
declare module 'psychrolib' {
  const psychrolib: {
    SI: number;
    IP: number;
    SetUnitSystem(system: number): void;
    GetUnitSystem(): number | undefined;
    GetStandardAtmPressure(altitude: number): number;
    GetStandardAtmTemperature(altitude: number): number;
    /** Saturation vapour pressure over liquid water or ice, Pa, at a dry-bulb temperature in °C (ASHRAE 2017 ch. 1 eqs. 5–6). */
    GetSatVapPres(dryBulb: number): number;
    /** Humidity ratio, kg water per kg dry air, from dry bulb (°C), relative humidity (0–1) and pressure (Pa). */
    GetHumRatioFromRelHum(dryBulb: number, relativeHumidity: number, pressure: number): number;
    /** Moist air density, kg of moist air per m³, from dry bulb (°C), humidity ratio and pressure (Pa) (ASHRAE 2017 ch. 1 eq. 11). */
    GetMoistAirDensity(dryBulb: number, humidityRatio: number, pressure: number): number;
  };
  export default psychrolib;
}
