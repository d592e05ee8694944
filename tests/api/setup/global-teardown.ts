/** Release the whole-run lock taken in global setup (closing its connection releases it). */
export default async function globalTeardown(): Promise<void> {
  const g = globalThis as Record<string, unknown>;
  const conn = g.__spinyardTestRunLock as { end(): Promise<void> } | undefined;
  if (!conn) return;
  delete g.__spinyardTestRunLock;
  await conn.end().catch(() => {});
}
