// Types for the parts of the fmin package (no bundled types) the dial-in uses.
declare module 'fmin' {
  export interface NelderMeadParameters {
    maxIterations?: number;
    nonZeroDelta?: number;
    zeroDelta?: number;
    minErrorDelta?: number;
    minTolerance?: number;
  }
  export function nelderMead(f: (x: number[]) => number, x0: number[], parameters?: NelderMeadParameters): { fx: number; x: number[] };
}
