/**
 * The writes kept on the device while there is no signal: readings, checklist ticks and
 * photos, in IndexedDB (one database per user), sent in the order they were recorded when
 * the network returns. Each carries an Idempotency-Key, so a write whose answer was lost
 * and is sent again is stored once. A write the server refuses (the step was signed off
 * meanwhile, the target changed, the member was removed) stays, with the server's message,
 * for the user to copy or discard; it is never dropped silently. Writes are sent only
 * while their own user is signed in.
 */
import { useSyncExternalStore } from 'react';
import { createStore, del, entries, set, type UseStore } from 'idb-keyval';
import { idempotencyKeyHeader, recordedByHeader } from '@shared/idempotency';
import { queryClient } from './query-client';

export type QueuedWrite = {
  /** The Idempotency-Key, also the entry's key on the device. */
  key: string;
  /** Order of recording. */
  seq: number;
  userId: string;
  buildId: string;
  stepId: string;
  kind: 'reading' | 'tick' | 'photo';
  method: 'POST' | 'PATCH';
  path: string;
  /** JSON body (readings, ticks). */
  body?: unknown;
  /** A photo, already resized on the device. */
  photo?: { blob: Blob; name: string; caption: string };
  /** What it is, in words, for the list of waiting entries. */
  label: string;
  /** When it was recorded on the device. */
  recordedAt: string;
  /** Set when the server refused it: kept until the user discards it. */
  problem?: { status: number; code: string; message: string };
};

type QueueState = {
  userId: string | null;
  items: QueuedWrite[];
  online: boolean;
  sending: boolean;
  lastSentAt: string | null;
};

const lastSentKey = (userId: string) => `headroom-last-sent:${userId}`;
export const queueDbName = (userId: string) => `headroom-queue-${userId}`;

let state: QueueState = {
  userId: null,
  items: [],
  online: typeof navigator === 'undefined' ? true : navigator.onLine,
  sending: false,
  lastSentAt: null,
};
let store: UseStore | null = null;
const listeners = new Set<() => void>();

function update(change: Partial<QueueState>) {
  state = { ...state, ...change };
  for (const l of listeners) l();
}

function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** The queue as the status line and the step page show it. */
export function useOfflineQueue(): QueueState {
  return useSyncExternalStore(subscribe, () => state);
}

export function currentQueue(): QueueState {
  return state;
}

/** Opens the signed-in user's queue (null: nobody signed in; their writes wait, unsent). */
export async function openQueue(userId: string | null) {
  if (userId === state.userId) return;
  store = userId ? createStore(queueDbName(userId), 'writes') : null;
  const items = store
    ? (await entries<string, QueuedWrite>(store))
        .map(([, v]) => v)
        .filter((v) => v.userId === userId)
        .sort((a, b) => a.seq - b.seq)
    : [];
  update({
    userId,
    items,
    lastSentAt: userId ? localStorage.getItem(lastSentKey(userId)) : null,
  });
  void flushQueue();
}

let lastSeq = 0;

/** Keeps a write on the device and tries to send it at once. */
export async function enqueue(
  write: Omit<QueuedWrite, 'key' | 'seq' | 'userId' | 'recordedAt'> & { key?: string },
): Promise<QueuedWrite> {
  if (!store || !state.userId) throw new Error('Sign in to record while offline');
  lastSeq = Math.max(Date.now(), lastSeq + 1);
  const item: QueuedWrite = {
    ...write,
    key: write.key ?? crypto.randomUUID(),
    seq: lastSeq,
    userId: state.userId,
    recordedAt: new Date().toISOString(),
  };
  await set(item.key, item, store);
  update({ items: [...state.items, item] });
  void flushQueue();
  return item;
}

/** Removes an entry the server refused, once the user has read (or copied) it. */
export async function discard(key: string) {
  if (store) await del(key, store);
  update({ items: state.items.filter((i) => i.key !== key) });
}

type Outcome = 'sent' | 'refused' | 'stop';

async function send(item: QueuedWrite): Promise<Outcome> {
  let body: BodyInit;
  const headers: Record<string, string> = {
    Accept: 'application/json',
    [idempotencyKeyHeader]: item.key,
    [recordedByHeader]: item.userId,
  };
  if (item.photo) {
    const form = new FormData();
    if (item.photo.caption) form.append('caption', item.photo.caption);
    form.append('photos', item.photo.blob, item.photo.name);
    body = form;
  } else {
    headers['Content-Type'] = 'application/json';
    body = JSON.stringify(item.body ?? {});
  }
  let res: Response;
  try {
    res = await fetch(item.path, {
      method: item.method,
      headers,
      body,
      credentials: 'same-origin',
    });
  } catch {
    return 'stop'; // No network after all: try again when it returns.
  }
  if (res.ok) return 'sent';
  // Signed out or expired: wait for the same user to sign in again. Busy or down: later.
  if (res.status === 401 || res.status === 429 || res.status >= 500) return 'stop';
  let problem = { status: res.status, code: `http_${res.status}`, message: '' };
  try {
    const json = (await res.json()) as { error?: { code?: string; message?: string } };
    problem = {
      status: res.status,
      code: json.error?.code ?? problem.code,
      message: json.error?.message ?? '',
    };
  } catch {
    // Not our JSON: the generic message below.
  }
  if (res.status === 404) {
    problem.message =
      'The build or step is no longer open to you (you may have been removed from the build, or it was deleted).';
  }
  if (!problem.message) problem.message = `The server refused it (${res.status}).`;
  const kept = { ...item, problem };
  if (store) await set(item.key, kept, store);
  update({ items: state.items.map((i) => (i.key === item.key ? kept : i)) });
  return 'refused';
}

/** Sends the waiting writes in order; stops at the first that cannot reach the server. */
export async function flushQueue() {
  if (state.sending || !state.userId || !navigator.onLine) return;
  const userId = state.userId;
  update({ sending: true });
  let sent = 0;
  try {
    for (const item of [...state.items]) {
      if (item.problem || state.userId !== userId) continue;
      const outcome = await send(item);
      if (outcome === 'stop') break;
      if (outcome === 'sent') {
        sent += 1;
        if (store) await del(item.key, store);
        const at = new Date().toISOString();
        localStorage.setItem(lastSentKey(userId), at);
        update({ items: state.items.filter((i) => i.key !== item.key), lastSentAt: at });
      }
    }
  } finally {
    update({ sending: false });
  }
  // What was sent (and refused) changes what the server shows: fetch it again.
  if (sent || state.items.some((i) => i.problem)) await queryClient.invalidateQueries();
}

if (typeof window !== 'undefined') {
  window.addEventListener('online', () => {
    update({ online: true });
    void flushQueue();
  });
  window.addEventListener('offline', () => update({ online: false }));
  // A write that met a busy server is tried again now and then.
  setInterval(() => {
    if (state.items.some((i) => !i.problem)) void flushQueue();
  }, 30_000);
}

/** Whether a write should be kept on the device instead of sent now. */
export const isOffline = () => typeof navigator !== 'undefined' && !navigator.onLine;
