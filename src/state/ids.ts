// New ids for saved machines.

let counter = 0;

/**
 * A new machine id: crypto.randomUUID when the browser offers it (secure pages only), else a
 * random version-4 UUID from crypto.getRandomValues, else time, Math.random and a counter.
 * `source` defaults to the global crypto.
 */
export function newId(
  source: Partial<Pick<Crypto, 'randomUUID' | 'getRandomValues'>> | undefined = globalThis.crypto,
): string {
  if (source && typeof source.randomUUID === 'function') return source.randomUUID();
  if (source && typeof source.getRandomValues === 'function') {
    const b = source.getRandomValues(new Uint8Array(16));
    // RFC 4122 §4.4: version 4 in the high nibble of byte 6, variant 10xx in byte 8.
    b[6] = (b[6] & 0x0f) | 0x40;
    b[8] = (b[8] & 0x3f) | 0x80;
    const hex = [...b].map((x) => x.toString(16).padStart(2, '0')).join('');
    return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
  }
  counter += 1;
  return `m-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}-${counter}`;
}
