export * from './types';
export * from './presets';
