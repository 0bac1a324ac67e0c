/** Typed fetch for the sync service: JSON in and out, errors carry the service's code and path. */
export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly path?: string,
  ) {
    super(message);
  }
}

export async function apiFetch<T>(path: string, init: RequestInit = {}): Promise<T> {
  // offline, the browser would only log a failed request: say so without asking
  if (typeof navigator !== 'undefined' && navigator.onLine === false)
    throw new ApiError(0, 'unreachable', 'the sync service cannot be reached (offline)');
  let res: Response;
  try {
    res = await fetch(`/api${path}`, {
      credentials: 'same-origin',
      ...init,
      headers: { 'Content-Type': 'application/json', ...(init.headers ?? {}) },
    });
  } catch {
    throw new ApiError(0, 'unreachable', 'the sync service cannot be reached');
  }
  const text = await res.text();
  let body: unknown = undefined;
  try {
    body = text ? JSON.parse(text) : undefined;
  } catch {
    throw new ApiError(
      res.status,
      'bad-response',
      'the service answered with something other than JSON',
    );
  }
  if (!res.ok) {
    const e = (body as { error?: { code?: string; message?: string; path?: string } } | undefined)
      ?.error;
    throw new ApiError(res.status, e?.code ?? 'error', e?.message ?? res.statusText, e?.path);
  }
  return body as T;
}
