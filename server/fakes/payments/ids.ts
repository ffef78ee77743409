import crypto from 'node:crypto';

/** Provider-style object ids: a type prefix and random characters, e.g. "cus_test_4f9c…". */
export const newId = (prefix: string) => `${prefix}_test_${crypto.randomBytes(9).toString('hex')}`;
