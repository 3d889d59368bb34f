import type { ApiErrorBody } from '@/shared/schemas/common';

/** Same origin by default; a separate API host can be set at build time. */
export const API_BASE = process.env.EXPO_PUBLIC_API_URL ?? '';

/** Every failed call: the HTTP status (0 when the network failed), the server's code and words. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  /** The whole parsed body, for answers that carry more (a 409 carries `current`). */
  readonly body: unknown;

  constructor(status: number, code: string, message: string, fields: Record<string, string> = {}, body: unknown = null) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.body = body;
  }
}

export interface ApiRequest {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** Extra request headers, e.g. `Idempotency-Key` on record writes. */
  headers?: Record<string, string>;
}

function isErrorBody(v: unknown): v is ApiErrorBody {
  if (typeof v !== 'object' || v === null || !('error' in v)) return false;
  const e = (v as { error: unknown }).error;
  return typeof e === 'object' && e !== null && typeof (e as { message?: unknown }).message === 'string';
}

/**
 * The one fetch wrapper: JSON both ways, the session cookie included, and any non-2xx turned
 * into an ApiError whose message is fit to show the keeper.
 */
export async function apiFetch<T>(path: string, { method = 'GET', body, signal, headers }: ApiRequest = {}): Promise<T> {
  let res: Response;
  try {
    res = await fetch(`${API_BASE}${path}`, {
      method,
      credentials: 'include',
      headers: {
        Accept: 'application/json',
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...headers,
      },
      body: body === undefined ? undefined : JSON.stringify(body),
      signal,
    });
  } catch (err) {
    if (err instanceof Error && err.name === 'AbortError') throw err;
    // Out-apiaries often have no signal: say so rather than "Failed to fetch".
    throw new ApiError(0, 'network', 'No connection to Frameside. Check your signal and try again.');
  }

  if (res.status === 204) return undefined as T;
  const text = await res.text();
  let parsed: unknown = null;
  if (text) {
    try {
      parsed = JSON.parse(text);
    } catch {
      parsed = null;
    }
  }

  if (!res.ok) {
    if (isErrorBody(parsed)) {
      const { code, message, fields } = parsed.error;
      throw new ApiError(res.status, code, message, fields ?? {}, parsed);
    }
    throw new ApiError(res.status, 'http', res.status >= 500 ? 'Frameside’s server had a problem. Try again in a moment.' : `The request failed (${res.status}).`, {}, parsed);
  }
  return parsed as T;
}
