import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OutageRig } from '../support/outage-trial.ts';

// PostgreSQL stopped in fast mode under 8–13 loops of design creations and unit recordings, against the real
// server in its own process and a throwaway cluster. A client checked out for a transaction used to have no
// 'error' listener, and its connection dying ended the process ("Unhandled 'error' event"). The bench runs
// twenty of these trials and prints how many crashed (tests/bench/outage.ts).

let rig: OutageRig;

beforeAll(async () => {
  rig = await OutageRig.create('outage-writes');
}, 120_000);

afterAll(async () => {
  await rig?.close();
});

describe('PostgreSQL stopped under write load', () => {
  it('keeps the server alive through five outages, answering 200/201/503 only, recovering each time and leaving nothing half-written', async () => {
    for (let trial = 0; trial < 5; trial++) {
      const result = await rig.trial(8 + trial, { loadBeforeStopMs: 300 + trial * 100 });
      expect(result.crashOutput).toBe('');
      expect(result.crashed).toBe(false);
      expect(result.unexpected).toEqual([]);
      expect(result.statuses[503]).toBeGreaterThan(0); // the outage was met
      expect(result.recovered).toBe(true);
      expect(result.designsWithoutRevision).toBe(0);
      expect(result.unitsWithoutAudit).toBe(0);
    }
  }, 180_000);
});
