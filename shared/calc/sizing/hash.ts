/**
 * A stable fingerprint of the inputs a sizing result came from, so a stored result can be recognised as stale
 * when any of them changes. Not a security hash: two 32-bit FNV-1a variants over a canonical JSON text.
 */

/**
 * JSON with object keys sorted at every level, so equal values always give equal text.
 *
 * @param value - plain data (objects, arrays, numbers, strings, booleans, null)
 * @returns canonical JSON; `undefined` members are left out, as JSON.stringify does
 * @example canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] }) // '{"a":[2,{"c":4,"d":3}],"b":1}'
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null';
  if (Array.isArray(value)) return `[${value.map((v) => (v === undefined ? 'null' : canonicalJson(v))).join(',')}]`;
  const o = value as Record<string, unknown>;
  const keys = Object.keys(o)
    .filter((k) => o[k] !== undefined)
    .sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(o[k])}`).join(',')}}`;
}

/**
 * 64-bit fingerprint of a text as 16 hex digits: FNV-1a (offset basis 2166136261) and a second pass with a
 * different basis and a final avalanche, concatenated.
 *
 * @param text - any string (UTF-16 code units are hashed)
 * @returns 16 lower-case hex digits
 * @example fingerprint('') // '811c9dc5' + …
 */
export function fingerprint(text: string): string {
  let h1 = 0x811c9dc5;
  let h2 = 0x9747b28c;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 0x01000193);
    h2 = Math.imul(h2 ^ c, 0x5bd1e995);
    h2 ^= h2 >>> 15;
  }
  h2 = Math.imul(h2 ^ (h2 >>> 13), 0xc2b2ae35);
  h2 ^= h2 >>> 16;
  return (h1 >>> 0).toString(16).padStart(8, '0') + (h2 >>> 0).toString(16).padStart(8, '0');
}
