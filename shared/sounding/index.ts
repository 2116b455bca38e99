/**
 * The sounding analysis engine: pure functions shared by the browser and the server.
 * Methods, units and sources: README.md; bibliography: REFERENCES.md.
 */
export * from './analyze';
export * from './composites';
export * from './constants';
export * from './environment';
export * from './hypsometric';
export * from './issue-codes';
export * from './kinematics';
export * from './lcl';
export * from './mixing-ratio';
export * from './moist-adiabat';
export {
  finiteOrNull,
  liftModifiedSurfaceParcel,
  liftParcel,
  liftParcelFromLevel,
  EFFECTIVE_CAPE_MIN,
  EFFECTIVE_CIN_MIN,
  type ParcelOptions,
  type ParcelResult,
  type ParcelStartObserved,
  type ParcelTracePoint,
} from './parcel';
export * from './parse-csv';
export * from './quality-flags';
export * from './saturation';
export * from './thermo';
export * from './types';
export * from './units';
export { validateSounding, describeLocation, MAX_FILE_BYTES, MAX_LEVELS, MIN_LEVELS } from './validate';
export * from './version';
export * from './wet-bulb';
export * from './key-figures';
