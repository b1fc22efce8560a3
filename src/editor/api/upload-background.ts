import { ApiError } from '../../lib/api-client';

/** POST the underlay image (multipart, field `image`); the server checks type and size. */
export async function uploadBackground(spaceId: string, file: File): Promise<{ url: string }> {
  const form = new FormData();
  form.append('image', file);
  const res = await fetch(`/api/spaces/${spaceId}/background`, { method: 'POST', body: form, credentials: 'same-origin' });
  const body = await res.json().catch(() => null);
  if (!res.ok) throw new ApiError(res.status, body?.error?.code ?? `http_${res.status}`, body?.error?.message ?? 'The image could not be uploaded.');
  return body as { url: string };
}
