/**
 * A reading carries the time it was taken from the start, online too, so that one whose
 * request is cut off goes again from the offline queue with the same key and the very same
 * body (the server refuses a reused key with a different body, and would otherwise date it
 * by when it finally arrived).
 */
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { CreateReadingInput } from '@shared/schemas/install-log';

const queued: { key?: string; body?: unknown }[] = [];
let offline = false;
vi.mock('@/lib/offline-queue', () => ({
  isOffline: () => offline,
  enqueue: vi.fn(async (write: { key?: string; body?: unknown }) => {
    queued.push(write);
    return { ...write, key: write.key ?? 'new-key' };
  }),
}));

const { recordReading } = await import('@/features/install-log/api/record-reading');
const { noteServerDate } = await import('@/lib/server-clock');

const input: CreateReadingInput = {
  position: 1,
  value: 31,
  unit: 'lbf-ft',
  expectedTarget: {
    targetValue: 30,
    targetUnit: 'lbf-ft',
    toleranceType: 'percent',
    toleranceValue: 10,
  },
};
const args = { buildId: 'b1', stepId: 's1', specId: 'f1', input, label: 'Bolts #1: 31 lbf·ft' };

type Sent = { body: Record<string, unknown>; key: string };
function stubFetch(answer: () => Promise<Response>) {
  const sent: Sent[] = [];
  vi.stubGlobal(
    'fetch',
    vi.fn(async (_path: string, init: RequestInit) => {
      const headers = init.headers as Record<string, string>;
      sent.push({ body: JSON.parse(init.body as string), key: headers['Idempotency-Key'] });
      return answer();
    }),
  );
  return sent;
}

beforeEach(() => {
  queued.length = 0;
  offline = false;
  noteServerDate(new Date().toUTCString());
});
afterEach(() => {
  vi.unstubAllGlobals();
  vi.useRealTimers();
});

describe('recordReading', () => {
  it('sends the time taken with a reading recorded online', async () => {
    const sent = stubFetch(async () => Response.json({ reading: {} }, { status: 201 }));
    const before = Date.now();
    await recordReading(args);
    expect(sent).toHaveLength(1);
    expect(sent[0].body).toMatchObject({ position: 1, value: 31 });
    const takenAt = Date.parse(sent[0].body.takenAt as string);
    expect(takenAt).toBeGreaterThanOrEqual(before - 1000);
    expect(takenAt).toBeLessThanOrEqual(Date.now() + 1000);
    expect(queued).toHaveLength(0);
  });

  it('keeps a reading cut off in flight with the same key and the same body, time taken included', async () => {
    const sent = stubFetch(() => Promise.reject(new TypeError('Failed to fetch')));
    const result = await recordReading(args);
    expect(result).toHaveProperty('queued');
    expect(queued).toHaveLength(1);
    expect(queued[0].key).toBe(sent[0].key);
    expect(queued[0].body).toEqual(sent[0].body);
    expect(queued[0].body).toHaveProperty('takenAt');
  });

  it('keeps a reading taken without signal with the time taken', async () => {
    offline = true;
    const sent = stubFetch(() => Promise.reject(new Error('not called')));
    await recordReading(args);
    expect(sent).toHaveLength(0);
    expect(queued[0].body).toMatchObject({ ...input, takenAt: expect.any(String) });
  });

  it("dates the reading by the server's clock when the phone's runs fast", async () => {
    vi.useFakeTimers({ now: new Date('2026-03-12T10:47:00Z'), toFake: ['Date'] });
    // The server answered at 10:42:00 while the phone said 10:47:00.
    noteServerDate('Thu, 12 Mar 2026 10:42:00 GMT');
    vi.setSystemTime(new Date('2026-03-12T10:50:00Z'));
    offline = true;
    await recordReading(args);
    expect((queued[0].body as { takenAt: string }).takenAt).toBe('2026-03-12T10:45:00.000Z');
  });
});
