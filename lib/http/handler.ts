// The one wrapper for route handlers: cross-site check -> validate (params, query) -> authenticate -> JSON body -> authorize
// (manuscript-scoped routes, through authorizeManuscript) -> run the handler -> respond, with JSON errors throughout.
import { z } from 'zod';
import { getCurrentUser, type CurrentUser } from '@/lib/auth/session';
import { authorizeManuscript, type ManuscriptAccess, type ManuscriptAction } from '@/lib/authz/manuscript-access';
import { crossSiteRefusal } from './cross-site';
import { jsonError, toErrorResponse, zodErrorResponse } from './errors';
import { readBodyText } from './read-body';

/** Bodies above 1 MB are refused while reading, with or without Content-Length (no route here takes more). */
export const MAX_JSON_BODY_BYTES = 1_000_000;

type Schema = z.ZodType;
type Output<S> = S extends Schema ? z.output<S> : undefined;

export interface RouteConfig<P, Q, B, A extends 'required' | 'optional', M extends ManuscriptAction | undefined> {
  /** Route segment params (`{ id }` …), validated first. */
  params?: P;
  /** URL search params, as an object of strings. */
  query?: Q;
  /** The JSON body. An empty body parses as `{}`; malformed JSON is a 400. */
  body?: B;
  /** 'required' (default): 401 without a session. 'optional': the handler gets `user: null`. */
  auth?: A;
  /** For manuscript-scoped routes: the action to authorise on `params.id` (the helper's 401/403/404/409 apply). */
  manuscript?: M;
  /** Status for a successful non-Response result (default 200). */
  status?: number;
}

export interface RouteContext<P, Q, B, A, M> {
  request: Request;
  params: Output<P>;
  query: Output<Q>;
  body: Output<B>;
  user: A extends 'optional' ? CurrentUser | null : CurrentUser;
  access: M extends ManuscriptAction ? ManuscriptAccess : undefined;
}

/** What Next passes as the second argument of a route handler (params is a Promise since Next 15). */
export interface NextRouteArgs {
  params: Promise<Record<string, string | string[] | undefined>>;
}

async function readJson(request: Request): Promise<{ ok: true; value: unknown } | { ok: false; response: Response }> {
  const body = await readBodyText(request, MAX_JSON_BODY_BYTES);
  if (!body.ok) {
    const response =
      body.reason === 'too-large'
        ? jsonError(413, 'The request body is too large')
        : jsonError(400, 'The request body is not valid UTF-8 text');
    return { ok: false, response };
  }
  const text = body.text;
  if (text.trim() === '') return { ok: true, value: {} };
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch {
    return { ok: false, response: jsonError(400, 'The request body is not valid JSON') };
  }
}

/**
 * Build a route handler.
 *
 * @example
 * export const PATCH = route(
 *   { params: manuscriptParamsSchema, body: updateManuscriptSchema, manuscript: 'edit' },
 *   async ({ access, body }) => ({ manuscript: await updateManuscript({ id: access.manuscript.id, ...body }) }),
 * );
 */
export function route<
  P extends Schema | undefined = undefined,
  Q extends Schema | undefined = undefined,
  B extends Schema | undefined = undefined,
  A extends 'required' | 'optional' = 'required',
  M extends ManuscriptAction | undefined = undefined,
>(
  config: RouteConfig<P, Q, B, A, M>,
  handler: (ctx: RouteContext<P, Q, B, A, M>) => Promise<unknown>,
): (request: Request, args: NextRouteArgs) => Promise<Response> {
  return async (request, args) => {
    try {
      // 0. refuse forged cross-site mutations (session cookie without our Origin, or a body that is not JSON)
      const crossSite = crossSiteRefusal(request, { json: true });
      if (crossSite) return crossSite;
      // 1. validate the address
      const rawParams = (await args?.params) ?? {};
      let params: unknown = undefined;
      if (config.params) {
        const parsed = config.params.safeParse(rawParams);
        if (!parsed.success) return zodErrorResponse(parsed.error, 'The address is not valid');
        params = parsed.data;
      }
      let query: unknown = undefined;
      if (config.query) {
        const parsed = config.query.safeParse(Object.fromEntries(new URL(request.url).searchParams));
        if (!parsed.success) return zodErrorResponse(parsed.error, 'The query string is not valid');
        query = parsed.data;
      }
      // 2. authenticate before reading any body
      const user = await getCurrentUser();
      if (!user && config.auth !== 'optional') return jsonError(401, 'Sign in to continue');
      // then validate the body
      let body: unknown = undefined;
      if (config.body) {
        const json = await readJson(request);
        if (!json.ok) return json.response;
        const parsed = config.body.safeParse(json.value);
        if (!parsed.success) return zodErrorResponse(parsed.error);
        body = parsed.data;
      }
      // 3. authorize
      let access: ManuscriptAccess | undefined;
      if (config.manuscript) {
        const manuscriptId = (params as { id?: unknown } | undefined)?.id;
        if (typeof manuscriptId !== 'string') throw new Error('route(): `manuscript` needs a params schema with `id`');
        access = await authorizeManuscript({ user, manuscriptId, need: config.manuscript });
      }
      // 4. call lib/ and 5. respond
      const result = await handler({ request, params, query, body, user, access } as RouteContext<P, Q, B, A, M>);
      if (result instanceof Response) return result;
      return Response.json(result ?? { ok: true }, { status: config.status ?? 200 });
    } catch (error) {
      return toErrorResponse(error);
    }
  };
}
