// A check's density grid as its own route serves it (64-bit little-endian floats, NaN outside the field).
import type { Client } from './http.ts';

export async function fetchDensityGrid(client: Client, checkId: string) {
  const res = await client
    .get(`/api/checks/${checkId}/density`)
    .buffer(true)
    .parse((response, done) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => done(null, Buffer.concat(chunks)));
    });
  const bytes = res.body as Buffer;
  const values = res.status === 200 ? new Float64Array(bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength)) : null;
  return { res, values };
}

/** The stored figures with the grid put back where the engine returns it (perHa, null outside the field). */
export async function withDensityGrid(client: Client, check: { id: string; result: Record<string, unknown> | null }) {
  const result = check.result as { density?: Record<string, unknown> | null } | null;
  if (!result?.density) return result;
  const { values } = await fetchDensityGrid(client, check.id);
  const perHa = Array.from(values ?? [], (value) => (Number.isNaN(value) ? null : value));
  return { ...result, density: { ...result.density, perHa } };
}
