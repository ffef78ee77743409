export * from './latin-hypercube';
export * from './nelder-mead';
export * from './search';
export * from './objective';
