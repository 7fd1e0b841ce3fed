/**
 * The API's one OpenAPI registry. Each resource describes its routes in its own
 * `<resource>.openapi.ts`, next to its zod schemas, with `registerRoute`; `document.ts` lists
 * those files and builds the OpenAPI 3.1 document from the registry.
 */
import {
  extendZodWithOpenApi,
  OpenAPIRegistry,
  type RouteConfig,
} from '@asteasolutions/zod-to-openapi';
import { z, type AnyZodObject, type ZodTypeAny } from 'zod';

// Adds `.openapi()` to the schemas of the zod copy the API validates with (before any is named).
extendZodWithOpenApi(z);

/** Error statuses a route may answer with; each becomes a response with the error shape. */
export type ErrorStatus = 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503;

/** Who may call a route: a signed-in user's bearer token, a station token, or anyone. */
export type RouteAuth = 'user' | 'station' | 'none';

/** One route, in the words the routers use (Express paths under /api). */
export interface RouteSpec {
  method: 'get' | 'post' | 'patch' | 'put' | 'delete';
  /** The Express path under /api, e.g. `/lots/:id`; parameters become `{id}`. */
  path: string;
  tag: string;
  summary: string;
  description?: string;
  auth: RouteAuth;
  params?: AnyZodObject;
  query?: AnyZodObject;
  headers?: AnyZodObject;
  /** A JSON request body. */
  body?: ZodTypeAny;
  /** A multipart/form-data request body (an upload). */
  form?: ZodTypeAny;
  /** The success answer; `schema` absent for a body-less answer (204). */
  ok: {
    status: 200 | 201 | 202 | 204;
    description: string;
    schema?: ZodTypeAny;
    /** Defaults to application/json. */
    contentType?: string;
    headers?: AnyZodObject;
  };
  /**
   * Error statuses besides those implied: 400 by params, query, headers or a body; 413 and 415
   * by a body; 401 and 503 by a credential.
   */
  errors?: ErrorStatus[];
}

const ERROR_WORDS: Record<ErrorStatus, string> = {
  400: 'The request is not valid; `details` names each field',
  401: 'No valid credentials',
  403: 'The caller may not do this',
  404: 'Not found (or not visible to the caller)',
  409: 'Conflicts with a stored record',
  413: 'The body is too large',
  415: 'The body has the wrong content type',
  422: 'Well formed but cannot be processed; `details` names the rows or fields',
  429: 'Too many requests; wait for Retry-After seconds',
  503: 'A service the request needs does not answer right now; retry after Retry-After seconds',
};

/** The one registry every resource registers into. */
export const registry = new OpenAPIRegistry();

/** `{ error: { code, message, details? } }`, the shape of every failed request. */
export const apiErrorSchema = registry.register(
  'Error',
  z
    .object({
      error: z
        .object({
          code: z.string().describe('Stable machine-readable code, e.g. validation_failed'),
          message: z.string(),
          details: z
            .union([
              z.array(z.object({ field: z.string(), problem: z.string() }).strict()),
              z.record(z.unknown()),
            ])
            .optional(),
        })
        .strict(),
    })
    .strict(),
);

/** Security scheme names, as the document's `components.securitySchemes` list them. */
export const SECURITY_SCHEMES = { user: 'userBearer', station: 'stationToken' } as const;

registry.registerComponent('securitySchemes', SECURITY_SCHEMES.user, {
  type: 'http',
  scheme: 'bearer',
  bearerFormat: 'JWT',
  description: 'The token `POST /auth/login` answers with',
});
registry.registerComponent('securitySchemes', SECURITY_SCHEMES.station, {
  type: 'http',
  scheme: 'bearer',
  description: 'A station token (`rts_…`) made on the probe-station page; only for station posts',
});

/** `/lots/:id` → `/lots/{id}` */
export function openApiPath(expressPath: string): string {
  return expressPath.replace(/:([A-Za-z0-9_]+)/g, '{$1}');
}

const retryAfter = z.object({
  'Retry-After': z.string().describe('Seconds to wait before trying again'),
});

function errorResponses(spec: RouteSpec): RouteConfig['responses'] {
  const statuses = new Set<ErrorStatus>(spec.errors ?? []);
  if (spec.params || spec.query || spec.body || spec.form || spec.headers) statuses.add(400);
  // every body is checked for its type and size before the route sees it
  if (spec.body || spec.form) for (const s of [413, 415] as const) statuses.add(s);
  // a credential is checked against the database, which may be out of reach for a moment
  if (spec.auth !== 'none') for (const s of [401, 503] as const) statuses.add(s);
  const responses: RouteConfig['responses'] = {};
  for (const status of [...statuses].sort((a, b) => a - b)) {
    responses[status] = {
      description: ERROR_WORDS[status],
      content: { 'application/json': { schema: apiErrorSchema } },
      ...(status === 429 || status === 503 ? { headers: retryAfter } : {}),
    };
  }
  return responses;
}

/** Registers one route: its parameters, body, success answer, error answers and security. */
export function registerRoute(spec: RouteSpec): void {
  const { ok } = spec;
  const body = spec.body
    ? { content: { 'application/json': { schema: spec.body } }, required: true }
    : spec.form
      ? { content: { 'multipart/form-data': { schema: spec.form } }, required: true }
      : undefined;
  registry.registerPath({
    method: spec.method,
    path: openApiPath(spec.path),
    tags: [spec.tag],
    summary: spec.summary,
    ...(spec.description ? { description: spec.description } : {}),
    ...(spec.auth === 'none' ? {} : { security: [{ [SECURITY_SCHEMES[spec.auth]]: [] }] }),
    request: {
      ...(spec.params ? { params: spec.params } : {}),
      ...(spec.query ? { query: spec.query } : {}),
      ...(spec.headers ? { headers: spec.headers } : {}),
      ...(body ? { body } : {}),
    },
    responses: {
      [ok.status]: {
        description: ok.description,
        ...(ok.schema
          ? { content: { [ok.contentType ?? 'application/json']: { schema: ok.schema } } }
          : {}),
        ...(ok.headers ? { headers: ok.headers } : {}),
      },
      ...errorResponses(spec),
    },
  });
}

/** `{ id }` path parameters as the routers read them (a positive whole number). */
export const idParams = z.object({ id: z.number().int().positive().max(2_147_483_647) });

/** A resource's own `registerRoute`, with its tag and (by default) the user's bearer token. */
export function routesOf(tag: string, auth: RouteAuth = 'user') {
  return (spec: Omit<RouteSpec, 'tag' | 'auth'> & { auth?: RouteAuth }): void =>
    registerRoute({ tag, auth, ...spec });
}

/** One of the usual routes of a resource kept by id: its words and any errors beyond the usual. */
interface CrudRoute {
  summary: string;
  /** Replaces the usual error statuses of this route. */
  errors?: ErrorStatus[];
}

/**
 * The usual routes of a resource kept by id, under one collection path: list and create at
 * `path`, read, update and delete at `path/:id`. Each is registered only when named.
 */
export interface CrudSpec {
  tag: string;
  auth?: RouteAuth;
  /** The collection path, e.g. `/lots`. */
  path: string;
  /** One item as the API answers it. */
  item: ZodTypeAny;
  /** What one item and many are called in the answers' descriptions, e.g. `['lot', 'lots']`. */
  names: readonly [string, string];
  list?: CrudRoute & { query: AnyZodObject; schema: ZodTypeAny };
  create?: CrudRoute & { body: ZodTypeAny };
  read?: CrudRoute;
  update?: CrudRoute & { body: ZodTypeAny };
  remove?: CrudRoute;
}

/**
 * Registers the routes of `spec` it names (see `CrudSpec`) with the usual answers: a page for the
 * list, the item for create (201), read and update, 204 for delete; and the usual errors (403 and
 * 409 for a create, 404 for a read, 403, 404 and 409 for an update or delete) unless replaced.
 */
export function registerCrud(spec: CrudSpec): void {
  const route = routesOf(spec.tag, spec.auth);
  const { path, item, list, create, read, update, remove } = spec;
  const [one, many] = spec.names;
  const byId = `${path}/:id`;
  const changes: ErrorStatus[] = [403, 404, 409];
  if (list)
    route({
      method: 'get',
      path,
      summary: list.summary,
      query: list.query,
      ok: { status: 200, description: `A page of ${many}`, schema: list.schema },
      ...(list.errors ? { errors: list.errors } : {}),
    });
  if (create)
    route({
      method: 'post',
      path,
      summary: create.summary,
      body: create.body,
      ok: { status: 201, description: `The new ${one}`, schema: item },
      errors: create.errors ?? [403, 409],
    });
  if (read)
    route({
      method: 'get',
      path: byId,
      summary: read.summary,
      params: idParams,
      ok: { status: 200, description: `The ${one}`, schema: item },
      errors: read.errors ?? [404],
    });
  if (update)
    route({
      method: 'patch',
      path: byId,
      summary: update.summary,
      params: idParams,
      body: update.body,
      ok: { status: 200, description: `The changed ${one}`, schema: item },
      errors: update.errors ?? changes,
    });
  if (remove)
    route({
      method: 'delete',
      path: byId,
      summary: remove.summary,
      params: idParams,
      ok: { status: 204, description: 'Deleted' },
      errors: remove.errors ?? changes,
    });
}
