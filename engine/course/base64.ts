/** Standard base64 (RFC 4648, with padding) without Node or DOM APIs. */
const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
const LOOKUP = new Int16Array(128).fill(-1);
for (let i = 0; i < ALPHABET.length; i++) LOOKUP[ALPHABET.charCodeAt(i)] = i;

export function bytesToBase64(bytes: Uint8Array): string {
  const parts: string[] = [];
  let chunk = '';
  for (let i = 0; i < bytes.length; i += 3) {
    const b0 = bytes[i];
    const b1 = i + 1 < bytes.length ? bytes[i + 1] : 0;
    const b2 = i + 2 < bytes.length ? bytes[i + 2] : 0;
    const n = (b0 << 16) | (b1 << 8) | b2;
    chunk +=
      ALPHABET[(n >> 18) & 63] +
      ALPHABET[(n >> 12) & 63] +
      (i + 1 < bytes.length ? ALPHABET[(n >> 6) & 63] : '=') +
      (i + 2 < bytes.length ? ALPHABET[n & 63] : '=');
    if (chunk.length >= 4096) {
      parts.push(chunk);
      chunk = '';
    }
  }
  parts.push(chunk);
  return parts.join('');
}

/** Decoded length of a well-formed base64 string, or −1 when it is not well-formed. */
export function base64DecodedLength(s: string): number {
  if (s.length % 4 !== 0) return -1;
  const pad = s.endsWith('==') ? 2 : s.endsWith('=') ? 1 : 0;
  return (s.length / 4) * 3 - pad;
}

/** Throws an Error naming the first bad character or the bad length. */
export function base64ToBytes(s: string): Uint8Array {
  const len = base64DecodedLength(s);
  if (len < 0) throw new Error(`base64 length must be a multiple of 4, got ${s.length}`);
  const out = new Uint8Array(len);
  let o = 0;
  for (let i = 0; i < s.length; i += 4) {
    let n = 0;
    for (let k = 0; k < 4; k++) {
      const ch = s.charCodeAt(i + k);
      let v: number;
      if (ch === 61 /* '=' */ && i + 4 === s.length && k >= 2) v = 0;
      else {
        v = ch < 128 ? LOOKUP[ch] : -1;
        if (v < 0) throw new Error(`base64 has an invalid character at position ${i + k}`);
      }
      n = (n << 6) | v;
    }
    if (o < len) out[o++] = (n >> 16) & 255;
    if (o < len) out[o++] = (n >> 8) & 255;
    if (o < len) out[o++] = n & 255;
  }
  return out;
}
