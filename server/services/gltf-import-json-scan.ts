/**
 * A bound on the glTF JSON before any parser sees it. JSON.parse, the Khronos validator and @gltf-transform
 * walk nested arrays and objects recursively, so a small file nesting 30,000 levels deep overflows the stack.
 * This scan is one loop over the bytes with a counter: it cannot overflow, and it refuses what no glTF needs.
 * Only the structural characters of RFC 8259 (§2: [ ] { } , and " with its \ escapes) are ASCII, and UTF-8
 * never uses bytes below 0x80 inside a multi-byte character, so scanning bytes instead of characters is exact.
 */
import { MAX_JSON_BYTES, MAX_JSON_DEPTH, MAX_JSON_ITEMS, refuse } from './gltf-import-refusals';

export interface JsonBounds {
  maxDepth: number;
  maxBytes: number;
  maxItems: number;
}

export const DEFAULT_JSON_BOUNDS: JsonBounds = { maxDepth: MAX_JSON_DEPTH, maxBytes: MAX_JSON_BYTES, maxItems: MAX_JSON_ITEMS };

const QUOTE = 0x22;
const BACKSLASH = 0x5c;
const OPEN_ARRAY = 0x5b;
const OPEN_OBJECT = 0x7b;
const CLOSE_ARRAY = 0x5d;
const CLOSE_OBJECT = 0x7d;
const COMMA = 0x2c;

/** Throws a refusal naming the problem when the JSON text is deeper, longer or has more items than the bounds allow. */
export function scanJsonBounds(bytes: Uint8Array, where: string, bounds: JsonBounds = DEFAULT_JSON_BOUNDS): void {
  if (bytes.length > bounds.maxBytes) {
    throw refuse('json_too_large', `${where} is ${(bytes.length / 1048576).toFixed(1)} MB of JSON; Treadle reads at most ${(bounds.maxBytes / 1048576).toFixed(0)} MB. Keep the mesh data in a .bin or a .glb instead of inside the JSON.`);
  }
  let depth = 0;
  let items = 0;
  let inString = false;
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i];
    if (inString) {
      if (b === BACKSLASH) i++;
      else if (b === QUOTE) inString = false;
      continue;
    }
    if (b === QUOTE) {
      inString = true;
    } else if (b === OPEN_ARRAY || b === OPEN_OBJECT) {
      if (++depth > bounds.maxDepth) {
        throw refuse(
          'json_too_deep',
          `${where} nests arrays or objects more than ${bounds.maxDepth} levels deep (at byte ${i}). A glTF file needs about a dozen levels; this looks like a damaged or hostile file, often a deep asset.extras or extras block.`,
        );
      }
      items++;
    } else if (b === CLOSE_ARRAY || b === CLOSE_OBJECT) {
      depth--;
    } else if (b === COMMA) {
      if (++items > bounds.maxItems) {
        throw refuse('json_too_large', `${where} holds more than ${bounds.maxItems.toLocaleString('en')} JSON values, far more than any game character's glTF. Export only the character.`);
      }
    }
  }
}
