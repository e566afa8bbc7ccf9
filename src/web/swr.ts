'use client';
/**
 * Client data fetching. `useApi(url)` is SWR over our JSON API; failures
 * surface as `ApiError` carrying the API's `{ error: { code, message, field } }`.
 * `apiSend(method, url, body)` performs a write and throws the same error.
 */
import useSWR, { type SWRConfiguration } from 'swr';

export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly field?: string;
  constructor(status: number, code: string, message: string, field?: string) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.field = field;
  }
}

async function toApiError(res: Response): Promise<ApiError> {
  try {
    const body = (await res.json()) as { error?: { code?: string; message?: string; field?: string } };
    if (body?.error?.message) return new ApiError(res.status, body.error.code ?? 'error', body.error.message, body.error.field);
  } catch {
    // not JSON: fall through
  }
  return new ApiError(res.status, 'http_error', `The server answered ${res.status} ${res.statusText || ''}`.trim() + '.');
}

export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  let res: Response;
  try {
    res = await fetch(url, {
      credentials: 'same-origin',
      ...init,
      headers: { accept: 'application/json', ...(init?.headers ?? {}) },
    });
  } catch {
    throw new ApiError(0, 'network', 'Cavitas could not be reached. Check your connection and try again.');
  }
  if (!res.ok) throw await toApiError(res);
  if (res.status === 204) return undefined as T;
  return (await res.json()) as T;
}

export function apiSend<T = unknown>(method: 'POST' | 'PUT' | 'PATCH' | 'DELETE', url: string, body?: unknown): Promise<T> {
  return fetchJson<T>(url, {
    method,
    headers: body === undefined ? {} : { 'content-type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

/** SWR hook; pass null as url to skip fetching. */
export function useApi<T>(url: string | null, config?: SWRConfiguration<T, ApiError>) {
  return useSWR<T, ApiError>(url, (u: string) => fetchJson<T>(u), config);
}
