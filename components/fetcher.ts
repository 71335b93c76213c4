// One typed fetcher for SWR and forms: an error body comes back as the same error shape.
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string[]> };
}

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly body: ApiErrorBody['error'],
  ) {
    super(body.message);
  }
}

export async function fetcher<T>(url: string, init?: RequestInit): Promise<T> {
  const res = await fetch(url, {
    ...init,
    headers: { accept: 'application/json', ...(init?.body && typeof init.body === 'string' ? { 'content-type': 'application/json' } : {}), ...init?.headers },
  });
  const text = await res.text();
  const data = text ? JSON.parse(text) : null;
  if (!res.ok) {
    const body = (data as ApiErrorBody | null)?.error ?? { code: 'http', message: `Request failed (${res.status})` };
    throw new ApiError(res.status, body);
  }
  return data as T;
}

export function sendJson<T>(url: string, method: 'POST' | 'PATCH' | 'PUT' | 'DELETE', body?: unknown) {
  return fetcher<T>(url, { method, body: body === undefined ? undefined : JSON.stringify(body) });
}
