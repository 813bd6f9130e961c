// Reading the instrument's result file for a standardization run (nothing is stored by it).
import { useMutation } from '@tanstack/react-query';
import type { components } from '../../../api/schema';
import { postMultipart } from '../../../api/upload.ts';

export type StandardizationFileReading = components['schemas']['StandardizationFileReading'];
export type StandardizationFileSample = components['schemas']['StandardizationFileSample'];

const FILE_PATH = '/instruments/{id}/standardizations/file';

export function useReadStandardizationFile() {
  return useMutation({
    mutationFn: async ({
      instrumentId,
      methodId,
      profileId,
      file,
    }: {
      instrumentId: string;
      methodId: string;
      profileId?: string;
      file: File;
    }) => {
      const form = new FormData();
      form.append('method_id', methodId);
      if (profileId) form.append('profile_id', profileId);
      form.append('file', file);
      // postMultipart takes the OpenAPI path for its types; the instrument id is filled in here.
      const path = FILE_PATH.replace('{id}', encodeURIComponent(instrumentId)) as typeof FILE_PATH;
      return (await postMultipart(path, form)).data as StandardizationFileReading;
    },
  });
}
