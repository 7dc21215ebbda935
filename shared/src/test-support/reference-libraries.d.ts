// Types for the untyped reference libraries the tests compare against. Only the calls the
// tests make are declared. Nothing in the shipped code imports these modules.
declare module 'psychrolib' {
  interface PsychroLib {
    readonly SI: number;
    readonly IP: number;
    SetUnitSystem(unitSystem: number): void;
    /** Dew point from dry-bulb temperature and relative humidity (fraction 0–1). */
    GetTDewPointFromRelHum(tDryBulb: number, relHum: number): number;
  }
  const psychrolib: PsychroLib;
  export default psychrolib;
}

declare module 'js-quantities' {
  interface Quantity {
    readonly scalar: number;
    to(unit: string): Quantity;
  }
  function Qty(value: string): Quantity;
  export default Qty;
}
