import crypto from 'node:crypto';

/**
 * Ids of the local test payment service, in its own words: "treadle-test-", what the object is, random hex,
 * e.g. "treadle-test-checkout-4f9c…". Nobody can take one for an id of a real payment provider.
 */
export const newId = (kind: string) => `treadle-test-${kind}-${crypto.randomBytes(9).toString('hex')}`;
