import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PhotoDto, Problem } from '@shared/api';
import { ApiError } from '@/lib/api-client';
import { invalidateAfterHoleWrite } from './invalidate';
import { holeKeys } from './keys';

/** What the form knows about when and where the photos were taken (phone browsers strip EXIF). */
export interface PhotoContext {
  caption?: string;
  /** ISO time the form recorded when the photos were taken or chosen. */
  takenAt?: string;
  /** The form's own GPS fix, WGS 84 degrees, with its horizontal accuracy in metres. */
  lat?: number;
  lon?: number;
  accuracy?: number;
  /**
   * One client-made id per file, in order, made when the photo was picked: a resend with the same
   * ids answers the photos already kept (200) instead of storing them again.
   */
  clientIds?: readonly string[];
}

export interface UploadProgress {
  loaded: number;
  total: number;
}

function problemOf(xhr: XMLHttpRequest): Problem {
  const fallback: Problem = { type: 'about:blank', title: xhr.statusText || `Upload failed (${xhr.status})`, status: xhr.status };
  if (xhr.status === 413) fallback.detail = 'The photos are too large for the server. Send fewer at a time, or smaller ones.';
  if (xhr.status === 415) fallback.detail = 'Only JPEG and PNG photos can be uploaded.';
  try {
    const body = JSON.parse(xhr.responseText) as Partial<Problem>;
    return { ...fallback, ...body, status: xhr.status };
  } catch {
    return fallback;
  }
}

/**
 * Upload photos to a hole in one multipart request (field `photos`), reporting upload progress.
 * XMLHttpRequest because fetch has no upload progress. Errors are thrown as {@link ApiError}.
 */
export function uploadPhotos(
  projectId: number,
  holeId: number,
  files: readonly File[],
  context: PhotoContext,
  onProgress?: (progress: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<PhotoDto[]> {
  const form = new FormData();
  for (const file of files) form.append('photos', file, file.name);
  for (const id of context.clientIds ?? []) form.append('clientId', id);
  if (context.caption?.trim()) form.append('caption', context.caption.trim());
  if (context.takenAt) form.append('takenAt', context.takenAt);
  if (context.lat != null && context.lon != null) {
    form.append('lat', String(context.lat));
    form.append('lon', String(context.lon));
    if (context.accuracy != null) form.append('accuracy', String(context.accuracy));
  }
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api/projects/${projectId}/holes/${holeId}/photos`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json, application/problem+json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.({ loaded: e.loaded, total: e.total });
    };
    xhr.onload = () => {
      if (xhr.status >= 200 && xhr.status < 300) {
        try {
          resolve(JSON.parse(xhr.responseText) as PhotoDto[]);
        } catch {
          resolve([]);
        }
      } else {
        reject(new ApiError(problemOf(xhr)));
      }
    };
    xhr.onerror = () =>
      reject(new ApiError({ type: 'about:blank', title: 'Cannot reach the Threadline server', status: 0, detail: 'The photos were not sent. Check the connection and try again.' }));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    xhr.send(form);
  });
}

export function useUploadPhotos(projectId: number, holeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (vars: { files: File[]; context: PhotoContext; onProgress?: (p: UploadProgress) => void; signal?: AbortSignal }) =>
      uploadPhotos(projectId, holeId, vars.files, vars.context, vars.onProgress, vars.signal),
    onSuccess: (photos) => {
      queryClient.setQueryData<PhotoDto[]>(holeKeys.photos(projectId, holeId), (old) => [...(old ?? []), ...photos]);
      return invalidateAfterHoleWrite(queryClient);
    },
  });
}
