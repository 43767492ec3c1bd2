// The browser side of the JSON API: one fetch wrapper that turns the error body into ApiError.
import { pathOf, type AnswerOf, type BodyInputOf, type Endpoint, type ParamsOf, type QueryInputOf } from "@/lib/contracts/endpoint";
import type { FieldErrors } from "@/lib/domain/errors";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: FieldErrors = {},
  ) {
    super(message);
    this.name = "ApiError";
  }
}

export async function callApi<T>(method: string, path: string, body?: unknown): Promise<T> {
  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers: body === undefined ? {} : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, "network", "No connection to the server. Check the network and try again.");
  }
  const data: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const error = (data as { error?: { code?: string; message?: string; fields?: FieldErrors } } | null)?.error;
    throw new ApiError(
      response.status,
      error?.code ?? "unknown",
      error?.message ?? `The server answered ${response.status}.`,
      error?.fields,
    );
  }
  return data as T;
}

type Filled<E> = keyof ParamsOf<E> extends never ? { params?: undefined } : { params: { [K in keyof ParamsOf<E>]: string | number } };
type WithQuery<E> =
  QueryInputOf<E> extends undefined
    ? { query?: undefined }
    : { query?: Partial<Record<keyof NonNullable<QueryInputOf<E>>, string | number | boolean | undefined>> };
type WithBody<E> = BodyInputOf<E> extends undefined ? { body?: undefined } : { body: BodyInputOf<E> };
export type CallInput<E> = Filled<E> & WithQuery<E> & WithBody<E>;

/**
 * Calls a declared endpoint (lib/contracts/endpoints): the path filled in from `params`, the query
 * from `query` (empty values left out), the body as JSON; the answer typed as the endpoint says.
 */
export function call<E extends Endpoint>(
  endpoint: E,
  ...[input]: keyof CallInput<E> extends never ? [] : [CallInput<E>?]
): Promise<AnswerOf<E>> {
  const { params, query, body } = (input ?? {}) as {
    params?: Record<string, string | number>;
    query?: Record<string, unknown>;
    body?: unknown;
  };
  let path = pathOf(endpoint.path, params ?? {});
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query ?? {})) if (value !== undefined && value !== "") search.set(key, String(value));
  if (search.size) path += `?${search.toString()}`;
  return callApi<AnswerOf<E>>(endpoint.method, path, body);
}
