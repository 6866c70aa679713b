// Minimal typings for the parts of psychrolib (UMD singleton, no bundled types) used by reference tests.
declare module 'psychrolib' {
  const psychrolib: {
    SI: number;
    IP: number;
    SetUnitSystem(units: number): void;
    /** Dew point [°C] from dry-bulb [°C] and relative humidity as a fraction 0–1 (SI units). */
    GetTDewPointFromRelHum(tDryBulb: number, relHum: number): number;
  };
  export = psychrolib;
}
