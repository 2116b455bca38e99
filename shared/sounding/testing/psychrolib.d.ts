// Types for the parts of psychrolib (npm, MIT; MeyerThevenard2019) used as a test reference.
declare module 'psychrolib' {
  interface Psychrometrics {
    SI: number;
    IP: number;
    SetUnitSystem(unitSystem: number): void;
    /** Humidity ratio, kg kg⁻¹, from vapour pressure (Pa) and pressure (Pa). */
    GetHumRatioFromVapPres(vaporPressurePa: number, pressurePa: number): number;
    /** Humidity ratio, kg kg⁻¹, from dewpoint (°C) and pressure (Pa). */
    GetHumRatioFromTDewPoint(dewpointC: number, pressurePa: number): number;
    /** Saturation vapour pressure, Pa, at a temperature (°C); over ice below 0.01 °C. */
    GetSatVapPres(temperatureC: number): number;
  }
  const psychrolib: Psychrometrics;
  export default psychrolib;
}
