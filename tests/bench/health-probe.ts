// GET /api/health probes, the bench's measure of whether other work stalls the web server.

const PROBE_EVERY_MS = 10;

/**
 * GET /api/health one at a time for at least `ms` and until `until()` holds, one every PROBE_EVERY_MS at most: a probe
 * sent back to back would take CPU from the work being measured, the more so the faster the server answers it.
 */
export async function healthTimes(baseUrl: string, ms: number, until: () => boolean = () => true): Promise<number[]> {
  const times: number[] = [];
  const end = performance.now() + ms;
  while (performance.now() < end || !until()) {
    const next = performance.now() + PROBE_EVERY_MS;
    const started = performance.now();
    await fetch(`${baseUrl}/api/health`).then((r) => r.arrayBuffer());
    times.push(performance.now() - started);
    await new Promise((r) => setTimeout(r, Math.max(0, next - performance.now())));
  }
  return times;
}
