// The browser side of the JSON API: one fetch wrapper that turns the error body into ApiError.
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
    throw new ApiError(response.status, error?.code ?? "unknown", error?.message ?? `The server answered ${response.status}.`, error?.fields);
  }
  return data as T;
}
