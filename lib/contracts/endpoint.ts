// One declaration per endpoint: method, path, who may call it, what its path, query and body hold,
// what it answers, and the README's words for it. The route handler (app/_adapters/handle.ts), the
// browser's typed call (lib/client/api.ts) and the README's API table (scripts/api-table.ts) are all
// made from it, so the three cannot drift apart. Pure: zod and types only, no server code.
import type { z } from "zod";
import type { Permission } from "@/lib/domain/access/permissions";
import { AppError } from "@/lib/domain/errors";

/** An answer whose shape the server builds from its rows and no browser code reads yet. */
export type JsonObject = Record<string, unknown>;

export type Method = "GET" | "POST" | "PUT" | "PATCH" | "DELETE";

/** "public": no session needed; "signed-in": any signed-in person; else the permission required. */
export type Access = "public" | "signed-in" | Permission;

/** A path segment's parser: the raw segment in, the value out, or a 404 when it cannot name anything. */
export type ParamParser<T = string> = (raw: string) => T;

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Whether a path segment can be an id at all (pages answer notFound() when it cannot). */
export function isUuid(value: string): boolean {
  return uuidPattern.test(value);
}

/** A path id that is not a UUID cannot name anything: 404, not a database error. */
export function idParam(value: string | undefined, what = "That record"): string {
  if (!value || !uuidPattern.test(value)) throw new AppError("not_found", `${what} was not found.`);
  return value.toLowerCase();
}

/** A UUID segment; `what` words the 404 ("That task card was not found."). */
export const uuidSegment =
  (what: string): ParamParser<string> =>
  (raw) =>
    idParam(raw, what);

/** A whole-number segment within [min, max]; anything else is a 404 worded with `what`. */
export const numberSegment =
  (what: string, { min = 1, max = 100_000 } = {}): ParamParser<number> =>
  (raw) => {
    const n = /^\d{1,9}$/.test(raw) ? Number(raw) : NaN;
    if (!Number.isInteger(n) || n < min || n > max) throw new AppError("not_found", `${what} was not found.`);
    return n;
  };

/** A segment checked by a zod schema, refused like a bad field (422) rather than as missing. */
export const schemaSegment =
  <S extends z.ZodType>(schema: S): ParamParser<z.output<S>> =>
  (raw) => {
    const result = schema.safeParse(raw);
    if (!result.success) throw new AppError("invalid", result.error.issues[0]?.message ?? "That value cannot be read.");
    return result.data;
  };

/** How the request carries its body. JSON is parsed with the schema; the others are read by the handler. */
export type BodySpec<S extends z.ZodType = z.ZodType> =
  { kind: "json"; schema: S; maxBytes?: number } | { kind: "multipart" } | { kind: "binary" };

/** What a successful answer is: JSON of type T, a file, or nothing (204). */
export type Answer<T> = { kind: "json"; type?: T } | { kind: "file"; type?: never } | { kind: "none"; type?: never };

export interface Endpoint<
  P extends string = string,
  Params extends Record<string, ParamParser<unknown>> = Record<string, ParamParser<unknown>>,
  Q extends z.ZodType | undefined = z.ZodType | undefined,
  B extends BodySpec | undefined = BodySpec | undefined,
  R = unknown,
  X extends Access = Access,
> {
  method: Method;
  /** With `:name` segments, e.g. "/api/cards/:id/publish". */
  path: P;
  access: X;
  params: Params;
  query: Q;
  body: B;
  answer: Answer<R>;
  /** The success status of a JSON answer (200 unless said). */
  status: number;
  /** Headers every answer carries (e.g. Cache-Control). */
  headers: Record<string, string>;
  /** README: who may call it, in people's words. */
  who: string;
  /** README: body → answer, and the failures worth knowing. */
  doc: string;
}

type ParamNames<P extends string> = P extends `${string}:${infer Name}/${infer Rest}`
  ? Name | ParamNames<`/${Rest}`>
  : P extends `${string}:${infer Name}`
    ? Name
    : never;

/** Marks the JSON answer's type (nothing is checked at run time: the server makes it from DTO types). */
export function json<T>(): Answer<T> {
  return { kind: "json" };
}
export const file: Answer<never> = { kind: "file" };
export const none: Answer<never> = { kind: "none" };

export function endpoint<
  const P extends string,
  Params extends { [K in ParamNames<P>]: ParamParser<unknown> },
  R,
  Q extends z.ZodType | undefined = undefined,
  B extends BodySpec | undefined = undefined,
  const X extends Access = Access,
>(def: {
  method: Method;
  path: P;
  access: X;
  params?: Params;
  query?: Q;
  body?: B;
  answer: Answer<R>;
  status?: number;
  headers?: Record<string, string>;
  who: string;
  doc: string;
}): Endpoint<P, Params, Q, B, R, X> {
  return {
    ...def,
    params: (def.params ?? {}) as Params,
    query: def.query as Q,
    body: def.body as B,
    status: def.status ?? 200,
    headers: def.headers ?? {},
  };
}

export type AnswerOf<E> =
  E extends Endpoint<string, Record<string, ParamParser<unknown>>, z.ZodType | undefined, BodySpec | undefined, infer R> ? R : never;
export type ParamsOf<E> = E extends Endpoint<string, infer Params> ? { [K in keyof Params]: ReturnType<Params[K]> } : never;
export type QueryOf<E> =
  E extends Endpoint<string, Record<string, ParamParser<unknown>>, infer Q> ? (Q extends z.ZodType ? z.output<Q> : undefined) : never;
export type QueryInputOf<E> =
  E extends Endpoint<string, Record<string, ParamParser<unknown>>, infer Q> ? (Q extends z.ZodType ? z.input<Q> : undefined) : never;
export type BodyOf<E> =
  E extends Endpoint<string, Record<string, ParamParser<unknown>>, z.ZodType | undefined, infer B>
    ? B extends { kind: "json"; schema: infer S extends z.ZodType }
      ? z.output<S>
      : undefined
    : never;
export type BodyInputOf<E> =
  E extends Endpoint<string, Record<string, ParamParser<unknown>>, z.ZodType | undefined, infer B>
    ? B extends { kind: "json"; schema: infer S extends z.ZodType }
      ? z.input<S>
      : undefined
    : never;

/** The path with its `:name` segments filled in (each encoded). */
export function pathOf(path: string, params: Record<string, string | number>): string {
  return path.replace(/:(\w+)/g, (_, name: string) => {
    const value = params[name];
    if (value === undefined) throw new Error(`No value for :${name} in ${path}`);
    return encodeURIComponent(String(value));
  });
}

/** The path as the README shows it: `{id}` for a segment, then the query's keys. */
export function shownPath(e: Endpoint): string {
  const path = e.path.replace(/:(\w+)/g, "{$1}");
  const shape = (e.query as unknown as { shape?: Record<string, unknown> } | undefined)?.shape;
  return shape
    ? `${path}?${Object.keys(shape)
        .map((k) => `${k}=`)
        .join("&")}`
    : path;
}
