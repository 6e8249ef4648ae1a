// The searching connections of the search bench (search-pool.ts), in a process of their own, as real clients are:
// reading their ~190 KB answers in the bench's process would delay the health probe's own timings there.

export interface SearchLoadData {
  url: string;
  headers: Record<string, string>;
  body: string;
  connections: number;
}
/** 'on' starts every connection; 'off' answers once the last search in flight is back; 'stop' also ends the process. */
export type SearchLoadMessage = { start: SearchLoadData } | 'on' | 'off' | 'stop';
export interface SearchLoadCounts {
  searches: number;
  failed: number;
}

const state = { on: false, stopped: false, inFlight: 0, searches: 0, failed: 0 };
const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
let loops: Promise<void>[] = [];

function start({ url, headers, body, connections }: SearchLoadData): void {
  loops = Array.from({ length: connections }, async () => {
    while (!state.stopped) {
      if (!state.on) {
        await pause(10);
        continue;
      }
      state.inFlight++;
      const res = await fetch(url, { method: 'POST', headers, body });
      await res.arrayBuffer();
      state.inFlight--;
      state.searches++;
      if (!res.ok) state.failed++;
    }
  });
}

process.on('message', async (message: SearchLoadMessage) => {
  if (typeof message === 'object') return start(message.start);
  if (message === 'on') {
    state.on = true;
    return;
  }
  state.on = false;
  if (message === 'stop') {
    state.stopped = true;
    await Promise.all(loops);
  }
  while (state.inFlight > 0) await pause(5);
  process.send!({ searches: state.searches, failed: state.failed } satisfies SearchLoadCounts);
  if (message === 'stop') process.disconnect();
});
