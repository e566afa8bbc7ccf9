/**
 * Browser-side calls to the data API. Failures surface the server's message
 * and field from `{ error: { code, message, field } }`.
 */
export class ApiFailure extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}

export async function api<T>(url: string, init?: RequestInit & { jsonBody?: unknown }): Promise<T> {
  const { jsonBody, ...rest } = init ?? {};
  const res = await fetch(url, {
    ...rest,
    headers: jsonBody !== undefined ? { 'content-type': 'application/json', ...(rest.headers ?? {}) } : rest.headers,
    body: jsonBody !== undefined ? JSON.stringify(jsonBody) : rest.body,
  });
  const text = await res.text();
  let data: unknown = null;
  try {
    data = text ? JSON.parse(text) : null;
  } catch {
    /* not JSON */
  }
  if (!res.ok) {
    const e = (data as { error?: { code?: string; message?: string; field?: string } } | null)?.error;
    throw new ApiFailure(res.status, e?.code ?? 'http_error', e?.message ?? `The server answered ${res.status}.`, e?.field);
  }
  return data as T;
}

/** SWR fetcher with the same error surface. */
export const fetcher = <T>(url: string) => api<T>(url);

/** SI power to the display units of a component: (mV/m)^2/Hz for Ez, pT^2/Hz for Bns/Bew. */
export function toDisplayPower(component: string, p: number): number {
  return component === 'Ez' ? p * 1e6 : p * 1e24;
}

export function displayUnit(component: string): string {
  return component === 'Ez' ? '(mV/m)^2/Hz' : 'pT^2/Hz';
}
