export * from './cholesky';
export * from './svd';
export * from './random';
