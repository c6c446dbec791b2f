import { apiErrorFrom, ApiRequestError, csrfTokenAfterRefusal, csrfTokenForWrite } from '@/lib/api-client';
import i18next from 'i18next';
import type { PhotoRef } from '../model/check-draft';

export const photoUrl = (id: string) => `/api/photos/${encodeURIComponent(id)}`;

function post(file: File, token: string, onProgress: (fraction: number) => void): Promise<PhotoRef> {
  // fetch() cannot report upload progress; XMLHttpRequest can, and a photo over hangar Wi-Fi takes a while.
  return new Promise((resolve, reject) => {
    const request = new XMLHttpRequest();
    request.open('POST', '/api/photos');
    request.withCredentials = true;
    request.setRequestHeader('X-CSRF-Token', token);
    request.setRequestHeader('Accept', 'application/json');
    // A refusal comes back in the screen's language, as the JSON client asks for it.
    if (i18next.resolvedLanguage) request.setRequestHeader('Accept-Language', i18next.resolvedLanguage);
    request.upload.onprogress = (event) => {
      if (event.lengthComputable && event.total > 0) onProgress(event.loaded / event.total);
    };
    request.onload = () => {
      if (request.status >= 200 && request.status < 300) {
        try {
          resolve(JSON.parse(request.responseText) as PhotoRef);
        } catch {
          reject(apiErrorFrom(request.status, ''));
        }
      } else reject(apiErrorFrom(request.status, request.responseText));
    };
    request.onerror = () => reject(new TypeError(i18next.t('photos.unreachable', { ns: 'checks' })));
    const form = new FormData();
    form.append('photo', file);
    request.send(form);
  });
}

/** Uploads one photo as multipart field "photo"; the server types it by its bytes and answers its id. */
export async function uploadPhoto(file: File, onProgress: (fraction: number) => void): Promise<PhotoRef> {
  try {
    return await post(file, await csrfTokenForWrite(), onProgress);
  } catch (error) {
    // A rotated token (sign-in, sign-out on this tablet) gets one fresh try, as the JSON client does.
    if (error instanceof ApiRequestError && error.code === 'csrf_invalid') {
      return post(file, await csrfTokenAfterRefusal(), onProgress);
    }
    throw error;
  }
}
