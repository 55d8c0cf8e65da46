// Ids the phone gives each photo and stop, so the server knows a second sending of the same one.
export function newClientId() {
  // randomUUID exists only in secure contexts; a phone on the office Wi-Fi over plain http still needs an id.
  return globalThis.crypto?.randomUUID?.() ?? `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}

/** A version 4 UUID (RFC 9562 §5.4) for a walk started on the phone; getRandomValues works without a secure context. */
export function newWalkId() {
  if (globalThis.crypto?.randomUUID) return globalThis.crypto.randomUUID();
  const bytes = globalThis.crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
