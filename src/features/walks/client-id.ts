// Ids the phone gives each photo and stop, so the server knows a second sending of the same one.
export function newClientId() {
  // randomUUID exists only in secure contexts; a phone on the office Wi-Fi over plain http still needs an id.
  return globalThis.crypto?.randomUUID?.() ?? `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;
}
