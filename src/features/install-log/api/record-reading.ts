import { useMutation, useQueryClient } from '@tanstack/react-query';
import { idempotencyKeyHeader } from '@shared/idempotency';
import type { CreateReadingInput, FastenerSpec, TorqueReading } from '@shared/schemas/install-log';
import { api, isApiError } from '@/lib/api-client';
import { enqueue, isOffline, type QueuedWrite } from '@/lib/offline-queue';
import { serverNow } from '@/lib/server-clock';
import { invalidateInstallLog, invalidateReadings, setCachedFastener } from './invalidate';
import { installBase, seg } from './paths';

export type RecordedReading = {
  reading: TorqueReading;
  /** The reading this one replaced (kept, marked superseded), if any. */
  supersededId: string | null;
  /** Recorded, but worth a look: e.g. the wrench was due for calibration. */
  warnings: string[];
  fastener: FastenerSpec;
};

/** Kept on the device, waiting for the network (lib/offline-queue sends it). */
export type QueuedReading = { queued: QueuedWrite };

export const isQueued = (r: RecordedReading | QueuedReading): r is QueuedReading => 'queued' in r;

/**
 * Records a torque reading; a correction is simply a new reading for the same position.
 * Without signal it is kept on the device with the time it was taken, and sent later.
 */
export async function recordReading({
  buildId,
  stepId,
  specId,
  input,
  label,
}: {
  buildId: string;
  /** The step the spec belongs to, for the cache. */
  stepId: string;
  specId: string;
  input: CreateReadingInput;
  /** The reading in words, for the list of entries waiting to be sent. */
  label: string;
}): Promise<RecordedReading | QueuedReading> {
  const path = `${installBase(buildId)}/fasteners/${seg(specId)}/readings`;
  const keep = async (body: CreateReadingInput, key?: string) => ({
    queued: await enqueue({
      key,
      buildId,
      stepId,
      kind: 'reading',
      method: 'POST',
      path,
      body,
      label,
    }),
  });
  // The time it was taken goes with every reading, online too: a reading whose request is
  // cut off is kept and sent again with the same key and the very same body (else the
  // server would refuse the key as reused, or date it by when it finally arrived).
  const body: CreateReadingInput = { ...input, takenAt: input.takenAt ?? serverNow() };
  if (isOffline()) return keep(body);
  const key = crypto.randomUUID();
  try {
    return await api.post<RecordedReading>(path, body, {
      headers: { [idempotencyKeyHeader]: key },
    });
  } catch (error) {
    // The signal dropped mid-request: it may have arrived, so the same key and body go
    // again from the queue (a repeat is stored once).
    if (isApiError(error) && error.status === 0) return keep(body, key);
    throw error;
  }
}

export const useRecordReading = () => {
  const queryClient = useQueryClient();
  return useMutation({
    // Runs without signal too: it keeps the write on the device itself (lib/offline-queue).
    networkMode: 'always',
    mutationFn: recordReading,
    onSuccess: async (result, { buildId, specId }) => {
      if (isQueued(result)) return;
      const { fastener } = result;
      // The verdict shows the moment the server answers; the rest of the step catches up.
      setCachedFastener(queryClient, buildId, fastener);
      await Promise.all([
        invalidateReadings(queryClient, buildId, specId),
        invalidateInstallLog(queryClient, buildId, fastener.stepId),
      ]);
    },
    // Refused (the step was signed off meanwhile, the spec changed): show the step as it is now.
    onError: (_error, { buildId, stepId }) => invalidateInstallLog(queryClient, buildId, stepId),
  });
};
