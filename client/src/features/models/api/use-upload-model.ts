import { useState } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { uploadResponseSchema, type UploadResponse } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export interface UploadRequest {
  file: File;
  modelName?: string;
}

/**
 * POST /api/projects/:pid/uploads (multipart: `file`, optional `modelName`), engineers
 * and admins. 201 with a new queued revision, or 200 with `duplicateOf` when the same
 * bytes were already uploaded to that model. Reports how much of the file has gone.
 */
export function useUploadModel(projectId: number) {
  const queryClient = useQueryClient();
  const [sent, setSent] = useState<{ loaded: number; total: number } | null>(null);
  const mutation = useMutation({
    mutationFn: async ({ file, modelName }: UploadRequest): Promise<UploadResponse> => {
      const form = new FormData();
      if (modelName) form.append('modelName', modelName);
      form.append('file', file, file.name);
      setSent({ loaded: 0, total: file.size });
      return api.upload(apiPath`/api/projects/${projectId}/uploads`, uploadResponseSchema, form, {
        onProgress: (loaded, total) => setSent({ loaded, total: total || file.size }),
      });
    },
    onSuccess: (answer) => {
      queryClient.setQueryData(queryKeys.models.revision(projectId, answer.revision.id), answer.revision);
      // The upload is an entry in the project log shown on the same page.
      void queryClient.invalidateQueries({ queryKey: queryKeys.projectLog.ofProject(projectId) });
      return queryClient.invalidateQueries({ queryKey: queryKeys.models.ofProject(projectId) });
    },
    onSettled: () => setSent(null),
  });
  return { ...mutation, sent };
}
