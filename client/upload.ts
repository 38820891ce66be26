// Uploading a recording with real progress: fetch() cannot report upload progress, XMLHttpRequest can.
import { apiBase, ApiRequestError } from './api';
import { ApiErrorSchema, type Recording, type RecordingKind } from '@/shared/schemas';

export function uploadRecording(
  songId: string,
  file: Blob & { name?: string },
  fields: { kind: RecordingKind; label?: string },
  onProgress: (fraction: number) => void,
): Promise<Recording> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    form.append('kind', fields.kind);
    if (fields.label) form.append('label', fields.label);
    form.append('file', file, file.name ?? 'recording');
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${apiBase}/api/songs/${songId}/recordings`);
    xhr.withCredentials = true;
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status === 201) return resolve(body as Recording);
      const parsed = ApiErrorSchema.safeParse(body);
      reject(
        new ApiRequestError(
          xhr.status,
          parsed.success ? parsed.data.error.message : `upload failed (${xhr.status})`,
          parsed.success ? parsed.data.error.field : undefined,
        ),
      );
    };
    xhr.onerror = () =>
      reject(new ApiRequestError(0, 'the upload was interrupted: check your connection and try again'));
    xhr.send(form);
  });
}
