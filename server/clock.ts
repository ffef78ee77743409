/** Time as the server sees it; tests pass a fake that they move by hand. */
export interface Clock {
  now(): number;
}

export const systemClock: Clock = { now: () => Date.now() };
