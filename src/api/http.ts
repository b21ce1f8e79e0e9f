/**
 * The only module that calls fetch. It sends JSON, parses each reply with the shared zod schema
 * and turns every failure — an error envelope, a non-JSON page from a proxy, a dropped
 * connection, a reply of the wrong shape — into one {@link ApiError}.
 */
import type { z } from 'zod';
import { errorEnvelopeSchema } from '@shared/schemas/errors';
import { ApiError } from './api-error';

/** All API paths hang below this prefix. */
export const API_BASE = '/api/v1';

export type HttpMethod = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export interface RequestOptions<T> {
  /** Sent as JSON (a FormData goes as multipart). */
  body?: unknown;
  query?: Record<string, string | number | boolean | undefined>;
  /** Parses the reply; omit for replies without a body (204). */
  schema?: z.ZodType<T>;
  signal?: AbortSignal;
}

/** Seconds from a Retry-After header (delta-seconds or HTTP date); undefined when absent or unreadable. */
export function parseRetryAfter(header: string | null, now: number = Date.now()): number | undefined {
  if (header === null || header.trim() === '') return undefined;
  const trimmed = header.trim();
  if (/^\d+$/.test(trimmed)) return Number(trimmed);
  const at = Date.parse(trimmed);
  if (Number.isNaN(at)) return undefined;
  return Math.max(0, Math.ceil((at - now) / 1000));
}

/** Words for a failing status when the reply carried no envelope (a proxy page, an empty body). */
function fallbackMessage(status: number): string {
  if (status === 502 || status === 503 || status === 504) {
    return `The server is not answering properly right now (HTTP ${status}). Try again in a moment.`;
  }
  if (status >= 500) return `The server ran into a problem (HTTP ${status}).`;
  return `The server refused the request (HTTP ${status}).`;
}

/**
 * Turns a failed reply into an ApiError. Pure, so it can be tested without a network: takes the
 * status, the Retry-After header and the raw body text.
 */
export function errorFromReply(status: number, retryAfter: string | null, bodyText: string): ApiError {
  const retryAfterSeconds = parseRetryAfter(retryAfter);
  let json: unknown;
  try {
    json = bodyText === '' ? undefined : JSON.parse(bodyText);
  } catch {
    json = undefined;
  }
  const envelope = errorEnvelopeSchema.safeParse(json);
  if (envelope.success) {
    const { code, message, details } = envelope.data.error;
    const merged: Record<string, unknown> = { ...(details ?? {}) };
    if (retryAfterSeconds !== undefined && merged.retryAfterSeconds === undefined) {
      merged.retryAfterSeconds = retryAfterSeconds;
    }
    return new ApiError(status, code, message, merged);
  }
  const details: Record<string, unknown> = retryAfterSeconds === undefined ? {} : { retryAfterSeconds };
  return new ApiError(status, 'unexpected_reply', fallbackMessage(status), details);
}

function buildUrl(path: string, query: RequestOptions<unknown>['query']): string {
  const url = API_BASE + path;
  if (!query) return url;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value !== undefined) params.set(key, String(value));
  }
  const text = params.toString();
  return text === '' ? url : `${url}?${text}`;
}

/**
 * Sends one API request. Resolves with the parsed reply (undefined for a body-less reply) or
 * rejects with an ApiError — never with anything else.
 */
export async function request<T = void>(method: HttpMethod, path: string, options: RequestOptions<T> = {}): Promise<T> {
  const headers: Record<string, string> = { Accept: 'application/json' };
  const init: RequestInit = { method, headers, credentials: 'same-origin' };
  if (options.signal) init.signal = options.signal;
  if (options.body instanceof FormData) {
    // The browser sets the multipart boundary itself.
    init.body = options.body;
  } else if (options.body !== undefined) {
    headers['Content-Type'] = 'application/json';
    init.body = JSON.stringify(options.body);
  }

  let response: Response;
  try {
    response = await globalThis.fetch(buildUrl(path, options.query), init);
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') {
      throw new ApiError(0, 'network_error', 'The request was cancelled.', { aborted: true });
    }
    throw new ApiError(0, 'network_error', 'Cannot reach the server. Check your connection and try again.');
  }

  const text = await response.text().catch(() => '');
  if (!response.ok) throw errorFromReply(response.status, response.headers.get('Retry-After'), text);
  if (!options.schema) return undefined as T;

  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new ApiError(response.status, 'unexpected_reply', 'The server sent a reply that is not JSON.');
  }
  const parsed = options.schema.safeParse(json);
  if (!parsed.success) {
    const where = parsed.error.issues[0]?.path.join('.') || 'the reply';
    throw new ApiError(
      response.status,
      'unexpected_reply',
      `The server's reply was not in the expected shape (at ${where}).`,
      {
        issues: parsed.error.issues.map((i) => ({ path: i.path.map(String), message: i.message })),
      },
    );
  }
  return parsed.data;
}

/** Verb-named shorthands over {@link request}. */
export const http = {
  get: <T>(path: string, options?: Omit<RequestOptions<T>, 'body'>) => request<T>('GET', path, options),
  post: <T = void>(path: string, body?: unknown, options?: Omit<RequestOptions<T>, 'body'>) =>
    request<T>('POST', path, { ...options, body }),
  patch: <T = void>(path: string, body?: unknown, options?: Omit<RequestOptions<T>, 'body'>) =>
    request<T>('PATCH', path, { ...options, body }),
  put: <T = void>(path: string, body?: unknown, options?: Omit<RequestOptions<T>, 'body'>) =>
    request<T>('PUT', path, { ...options, body }),
  delete: <T = void>(path: string, options?: Omit<RequestOptions<T>, 'body'>) => request<T>('DELETE', path, options),
};
