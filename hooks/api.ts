// The one way the client talks to the API: same origin, cookies included, JSON both ways.
// Errors arrive as ApiRequestError carrying the server's { code, message, fields }.
import type { ApiError } from '../model/api';

export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly body: unknown = null,
  ) {
    super(message);
  }
}

export async function api<T>(path: string, init: { method?: string; body?: unknown; signal?: AbortSignal } = {}): Promise<T> {
  const res = await fetch(`/api${path}`, {
    method: init.method ?? 'GET',
    credentials: 'same-origin',
    headers: init.body !== undefined ? { 'content-type': 'application/json' } : undefined,
    body: init.body !== undefined ? JSON.stringify(init.body) : undefined,
    signal: init.signal,
  });
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  const data = text ? (JSON.parse(text) as unknown) : null;
  if (!res.ok) {
    const e = (data as ApiError | null)?.error;
    throw new ApiRequestError(res.status, e?.code ?? 'http_error', e?.message ?? `HTTP ${res.status}`, e?.fields ?? {}, data);
  }
  return data as T;
}
