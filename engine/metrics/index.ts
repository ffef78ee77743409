export * from './step-response';
export * from './stumble-thresholds';
export * from './stumble-detector';
export * from './detect-series';
export * from './footing-score';
export * from './trial-metrics';
export * from './response-window';
