import type { z } from 'zod';
import { errorBodySchema } from '@shared/schemas/common';
import { sessionResponseSchema } from '@shared/schemas/session';
import { api } from '../../../lib/api-client';
import { ApiError } from '../../../lib/api-error';

export interface FormAnswer<T> {
  status: number;
  data: T;
}

// The shared client only sends JSON. A file goes as multipart, with the same CSRF header, cookie policy and error
// shape. The token is read fresh, so an upload after a long idle tab does not fail on a renewed session.
const csrfToken = async () => (await api.get('/api/session', sessionResponseSchema)).csrfToken;

async function send(path: string, form: FormData, token: string): Promise<Response> {
  try {
    return await fetch(path, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { Accept: 'application/json', 'X-CSRF-Token': token },
      body: form,
    });
  } catch {
    throw new ApiError({ status: 0, code: 'network', message: 'Nestflow could not be reached. Check the connection and try again.' });
  }
}

async function toApiError(response: Response): Promise<ApiError> {
  const parsed = errorBodySchema.safeParse(await response.json().catch(() => undefined));
  if (parsed.success) return new ApiError({ status: response.status, ...parsed.data.error });
  // A proxy in front of the API answers a too-large body with its own page, not our error shape.
  if (response.status === 413) return new ApiError({ status: 413, code: 'too_large', message: 'The file is too large to upload.' });
  const message = response.status >= 500 ? 'The server could not complete this request. Try again in a moment.' : `The upload failed (${response.status}).`;
  return new ApiError({ status: response.status, code: `http_${response.status}`, message });
}

/** POST a multipart form; resolves with the status too, since 200 and 202 mean different things for an upload. */
export async function postForm<T>(path: string, form: FormData, schema: z.ZodType<T>): Promise<FormAnswer<T>> {
  let response = await send(path, form, await csrfToken());
  let error = response.ok ? undefined : await toApiError(response);
  if (error?.code === 'csrf_invalid') {
    // Refused before anything was read, so one retry with a fresh token is safe.
    response = await send(path, form, await csrfToken());
    error = response.ok ? undefined : await toApiError(response);
  }
  if (error) throw error;
  const parsed = schema.safeParse(await response.json().catch(() => undefined));
  if (!parsed.success) {
    throw new ApiError({ status: response.status, code: 'unexpected_response', message: 'The server sent an answer this page cannot read.' });
  }
  return { status: response.status, data: parsed.data };
}
