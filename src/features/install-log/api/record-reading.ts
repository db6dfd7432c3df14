import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  CreateReadingInput,
  FastenerSpec,
  TorqueReading,
} from '../../../../shared/schemas/install-log';
import { api } from '../../../lib/api-client';
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

/** Records a torque reading; a correction is simply a new reading for the same position. */
export async function recordReading({
  buildId,
  specId,
  input,
}: {
  buildId: string;
  /** The step the spec belongs to, for the cache. */
  stepId: string;
  specId: string;
  input: CreateReadingInput;
}): Promise<RecordedReading> {
  return api.post<RecordedReading>(
    `${installBase(buildId)}/fasteners/${seg(specId)}/readings`,
    input,
  );
}

export const useRecordReading = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordReading,
    onSuccess: async ({ fastener }, { buildId, specId }) => {
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
