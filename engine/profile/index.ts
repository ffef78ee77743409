/** Leg profiles: the file's schema, its JSON Schema, suite metrics, version diffs, the regression verdict and the game runtime. */
export * from './schema';
export * from './suite-metrics';
export * from './run-suite';
export * from './metric-rows';
export * from './export';
export * from './diff';
export * from './check';
export * from './rig-mapping';
export {
  loadLegProfile,
  bindLegProfile,
  createLegRuntime,
  createRigRuntime,
  RUNTIME_STUMBLE_KINDS,
  type BoundLegProfile,
  type GroundQuery,
  type LegRuntime,
  type LegRuntimeError,
  type LegRuntimeOptions,
} from './runtime';
