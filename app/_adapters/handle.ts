import "server-only";
import type { z } from "zod";
import type { AnswerOf, BodyOf, Endpoint, ParamsOf, QueryOf } from "@/lib/contracts/endpoint";
import { parseWith, readJson, route } from "@/lib/server/http";
import { requireApiUser, type SessionUser } from "./session";

type Segments = Promise<Record<string, string | string[] | undefined>>;

interface Call<E extends Endpoint, A> {
  request: Request;
  actor: A;
  params: ParamsOf<E>;
  query: QueryOf<E>;
  body: BodyOf<E>;
}

type ActorOf<E extends Endpoint> = E["access"] extends "public" ? null : SessionUser;

/** JSON of the declared type, a Response of the handler's own, or nothing for a 204. */
type Result<E extends Endpoint> = AnswerOf<E> | Response | void;

/**
 * The route handler of a declared endpoint: the edge checks of route(), then the session and the
 * permission the endpoint names, its path segments (404 when one cannot name anything), its query
 * and its JSON body (422 naming the field), then `fn`. A plain value is sent as JSON with the
 * endpoint's status and headers; `fn` returns a Response itself for files and special statuses.
 */
export function handle<E extends Endpoint>(
  endpoint: E,
  fn: (call: Call<E, ActorOf<E>>) => Promise<Result<E>>,
): (request: Request, context: { params: Segments }) => Promise<Response> {
  return route<{ params: Segments }>(async (request, context) => {
    const actor = (
      endpoint.access === "public" ? null : await requireApiUser(endpoint.access === "signed-in" ? undefined : endpoint.access)
    ) as ActorOf<E>;
    const raw = context?.params ? await context.params : {};
    const params: Record<string, unknown> = {};
    for (const [name, parse] of Object.entries(endpoint.params)) params[name] = parse(String(raw[name] ?? ""));
    const query = endpoint.query
      ? parseWith(endpoint.query as z.ZodType, Object.fromEntries(new URL(request.url).searchParams))
      : undefined;
    const body =
      endpoint.body?.kind === "json" ? await readJson(request, endpoint.body.schema, { maxBytes: endpoint.body.maxBytes }) : undefined;
    const result = await fn({ request, actor, params: params as ParamsOf<E>, query: query as QueryOf<E>, body: body as BodyOf<E> });
    if (result instanceof Response) return result;
    if (result === undefined || endpoint.answer.kind === "none") return new Response(null, { status: 204, headers: endpoint.headers });
    return Response.json(result, { status: endpoint.status, headers: endpoint.headers });
  });
}
