'use client';
/**
 * The one client data layer. `useApi(url)` is SWR over our JSON API; failures
 * surface as `ApiError` carrying the API's `{ error: { code, message, field } }`.
 * `apiSend(method, url, body)` performs a write and `apiUpload(url, file)`
 * streams a file with progress; both throw the same error.
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

/** The error for a failed answer: the server's `{ error }` when the body carries one, else its status. */
function apiErrorOf(status: number, statusText: string, body: string): ApiError {
  try {
    const e = (JSON.parse(body) as { error?: { code?: string; message?: string; field?: string } } | null)?.error;
    if (e?.message) return new ApiError(status, e.code ?? 'error', e.message, e.field);
  } catch {
    // not JSON: fall through
  }
  return new ApiError(status, 'http_error', `The server answered ${status} ${statusText || ''}`.trim() + '.');
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
  if (!res.ok) throw apiErrorOf(res.status, res.statusText, await res.text());
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

/** Sends a file as the raw request body, reporting the bytes sent so far; resolves with the JSON answer. */
export function apiUpload<T>(url: string, file: Blob, onProgress: (sent: number) => void): Promise<T> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest(); // fetch cannot report upload progress
    xhr.open('POST', url);
    xhr.setRequestHeader('content-type', 'application/octet-stream');
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (e) => onProgress(e.loaded);
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The connection broke while sending; try again.'));
    xhr.onload = () => {
      if (xhr.status < 200 || xhr.status >= 300) reject(apiErrorOf(xhr.status, xhr.statusText, xhr.responseText));
      else {
        try {
          resolve(JSON.parse(xhr.responseText) as T);
        } catch {
          reject(new ApiError(xhr.status, 'http_error', 'The server answered with something other than JSON.'));
        }
      }
    };
    xhr.send(file);
  });
}

/** SWR hook; pass null as url to skip fetching. */
export function useApi<T>(url: string | null, config?: SWRConfiguration<T, ApiError>) {
  return useSWR<T, ApiError>(url, (u: string) => fetchJson<T>(u), config);
}
