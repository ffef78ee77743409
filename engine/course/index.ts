export * from './limits';
export * from './heightfield';
export * from './sample';
export * from './ground';
export * from './generators';
export * from './brushes';
export * from './encoding';
export * from './walk-path';
