// The one gate every route handler, server action and signed-in page goes through:
// it reads the session, re-reads the caller's membership (the role lives only there),
// checks the role, and parses the input with zod.
import "server-only";
import { headers } from "next/headers";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import type { z } from "zod";
import { getMember, getMemberWithTeams, listTeamsOf, type TeamOfUser } from "@/db/queries/users";
import type { Role } from "@/db/schema";
import { HttpError, errorResponse, invalid, json } from "@/lib/http";
import { readBodyText } from "@/lib/read-upload";
import { assertSameOrigin } from "./same-origin";
import { sessionClaims } from "./session-claims";
import { bearerSecret, callerFromToken } from "./tokens";
import { can, describeRoles, doingOf, rolesFor, type Action, type ResourceArg } from "./policy";

export type Caller = {
  userId: string;
  email: string;
  name: string;
  teamId: string;
  teamName: string;
  role: Role;
  /** How the request proved who it is: a session cookie or a personal API token. */
  via: "session" | "token";
  /** What the request may do: a session always writes; a token as its access says. */
  access: "read" | "write";
};

/**
 * The caller: the owner of a bearer token (lib/auth/tokens.ts: 401 when the token is not valid),
 * else the signed-in session's member, else null (also when the session was ended: sign-out,
 * password change, removal).
 */
export async function currentCaller(): Promise<Caller | null> {
  const bearer = bearerSecret((await headers()).get("authorization"));
  if (bearer !== null) {
    const { tokenId: _tokenId, ...caller } = await callerFromToken(bearer);
    return caller;
  }
  const session = await sessionClaims();
  if (!session?.userId || !session.teamId) return null;
  const member = await getMember(session.userId, session.teamId);
  if (!member || member.sessionVersion !== (session.sessionVersion ?? 0)) return null;
  const { sessionVersion: _version, ...caller } = member;
  return { ...caller, via: "session", access: "write" };
}

export { describeRoles };

/**
 * 403 unless the policy allows the action (lib/auth/policy.ts). `refusal` words a refusal that
 * comes from the resource rather than the role ("you wrote this revision").
 */
export function authorize<A extends Action>(
  caller: Caller,
  action: A,
  options: { doing?: string; refusal?: string } = {},
  ...resource: ResourceArg<A>
) {
  const doing = options.doing ?? doingOf(action);
  if (!rolesFor(action).includes(caller.role)) {
    throw new HttpError(
      403,
      `Only ${describeRoles(rolesFor(action))} may ${doing}; you are signed in as a ${caller.role}.`,
    );
  }
  if (!can(caller, action, ...resource)) {
    throw new HttpError(403, options.refusal ?? `You may not ${doing}.`);
  }
}

/** The gate's own checks: a read-only token only reads; then the action's (or legacy roles') rule. */
function checkOptions(
  caller: Caller,
  options: { action?: Action; roles?: readonly Role[]; doing?: string },
  method: string,
) {
  if (caller.access === "read" && !["GET", "HEAD"].includes(method.toUpperCase())) {
    throw new HttpError(403, "This API token is read-only: it may only GET. Create a token with write access.");
  }
  if (options.action) authorize(caller, options.action, { doing: options.doing });
  if (options.roles && !options.roles.includes(caller.role)) {
    const doing = options.doing ?? "do this";
    throw new HttpError(
      403,
      `Only ${describeRoles(options.roles)} may ${doing}; you are signed in as a ${caller.role}.`,
    );
  }
}

/** The largest JSON body read (API.md: 413 above it), in decimal bytes. */
export const MAX_JSON_BYTES = 1_000_000;

const jsonTooLarge = () => new HttpError(413, "The request body is larger than 1 MB.");

/** Whether a request carries a body at all (declared length above zero, or chunked). */
function hasBody(request: Request): boolean {
  const length = request.headers.get("content-length");
  if (length !== null) return Number(length) !== 0;
  return request.headers.has("transfer-encoding") || request.body !== null;
}

/**
 * A JSON body: 415 unless it says application/json (a cross-site form can only send text/plain,
 * form-urlencoded or multipart without asking first), 413 past 1 MB however it is framed, 422 when
 * not JSON. No body at all reads as {} (a bare POST to submit).
 */
export async function readJson(request: Request): Promise<unknown> {
  if (!hasBody(request)) return {};
  const type = (request.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (type !== "application/json" && !/^application\/[a-z0-9.+-]*\+json$/.test(type))
    throw new HttpError(
      415,
      `Send the body as JSON with Content-Type: application/json${type ? ` (this request says ${truncateType(type)})` : ""}.`,
    );
  const text = await readBodyText(request, MAX_JSON_BYTES, jsonTooLarge);
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new HttpError(422, "The request body is not valid JSON.", { "(body)": ["is not valid JSON"] });
  }
}

const truncateType = (type: string) => (type.length > 60 ? `${type.slice(0, 60)}…` : type);

type RouteContext = { params: Promise<Record<string, string | string[]>> };

type Options<B, Q> = {
  /** The policy action the route performs (lib/auth/policy.ts); omit for any team member. */
  action?: Action;
  /** @deprecated name an `action` instead; kept so a route written before the policy still checks roles. */
  roles?: readonly Role[];
  /** What the caller is trying to do, for the 403 message (defaults to the action's own words). */
  doing?: string;
  body?: z.ZodType<B>;
  query?: z.ZodType<Q>;
};

type Handler<B, Q> = (ctx: {
  caller: Caller;
  body: B;
  query: Q;
  params: Record<string, string>;
  request: Request;
}) => Promise<Response | object>;

/** Wraps a route handler: 401 signed out, 403 wrong role, 422 bad input, never an unhandled 500. */
export function apiRoute<B = undefined, Q = undefined>(options: Options<B, Q>, handler: Handler<B, Q>) {
  return async (request: Request, context: RouteContext): Promise<Response> => {
    try {
      assertSameOrigin(request);
      const caller = await currentCaller();
      if (!caller) throw new HttpError(401, "Sign in first.");
      checkOptions(caller, options, request.method);
      const rawParams = context?.params ? await context.params : {};
      const params = Object.fromEntries(
        Object.entries(rawParams).map(([k, v]) => [k, Array.isArray(v) ? v.join("/") : v]),
      );
      const body = options.body ? parseWith(options.body, await readJson(request)) : (undefined as B);
      const query = options.query
        ? parseWith(options.query, Object.fromEntries(new URL(request.url).searchParams))
        : (undefined as Q);
      const result = await handler({ caller, body, query, params, request });
      return result instanceof Response ? result : json(result);
    } catch (e) {
      return toErrorResponse(e);
    }
  };
}

/** A public route (health): still catches every error into JSON. */
export function publicRoute(handler: (request: Request) => Promise<Response | object>) {
  return async (request: Request): Promise<Response> => {
    try {
      assertSameOrigin(request);
      const result = await handler(request);
      return result instanceof Response ? result : json(result);
    } catch (e) {
      return toErrorResponse(e);
    }
  };
}

export function parseWith<T>(schema: z.ZodType<T>, input: unknown, prefix = ""): T {
  const parsed = schema.safeParse(input);
  if (!parsed.success) throw invalid(parsed.error, prefix);
  return parsed.data;
}

export function toErrorResponse(e: unknown): Response {
  if (e instanceof HttpError) return errorResponse(e);
  console.error("[api] unexpected error", e);
  return json({ message: "Something went wrong on the server; nothing was changed. The error has been logged." }, 500);
}

/**
 * A signed-in page's caller with the caller's teams (the header lists them): for a session, the
 * membership and the team list in one read; for a bearer token, as currentCaller, then the teams.
 */
async function currentPageCaller(): Promise<{ caller: Caller; teams: TeamOfUser[] } | null> {
  if (bearerSecret((await headers()).get("authorization")) !== null) {
    const caller = await currentCaller();
    return caller && { caller, teams: await listTeamsOf(caller.userId) };
  }
  const session = await sessionClaims();
  if (!session?.userId || !session.teamId) return null;
  const member = await getMemberWithTeams(session.userId, session.teamId);
  if (!member || member.sessionVersion !== (session.sessionVersion ?? 0)) return null;
  const { sessionVersion: _version, teams, ...caller } = member;
  return { caller: { ...caller, via: "session", access: "write" }, teams };
}

const pageCaller = cache(currentPageCaller);

/** The signed-in page caller's teams, from the same cached read as requirePageCaller (call that first). */
export async function pageCallerTeams(): Promise<TeamOfUser[]> {
  return (await pageCaller())?.teams ?? [];
}

/**
 * For signed-in pages: redirects to /sign-in when signed out, answers the not-found page to a
 * role outside `roles`. Wrapped in React's cache(), with the session read cached on its own, so
 * a layout and its page share one session and membership read per request.
 */
export const requirePageCaller = cache(async (next?: string, roles?: readonly Role[]): Promise<Caller> => {
  const caller = (await pageCaller())?.caller;
  if (!caller) redirect(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  if (roles && !roles.includes(caller.role)) notFound();
  return caller;
});

export type ActionResult<T> =
  { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/** Wraps a server action the same way apiRoute wraps a route. */
export function serverAction<I, T>(
  options: { action?: Action; roles?: readonly Role[]; doing?: string; input: z.ZodType<I> },
  fn: (ctx: { caller: Caller; input: I }) => Promise<T>,
) {
  return async (raw: unknown): Promise<ActionResult<T>> => {
    try {
      const caller = await currentCaller();
      if (!caller) throw new HttpError(401, "Sign in first.");
      checkOptions(caller, options, "POST");
      const input = parseWith(options.input, raw);
      return { ok: true, data: await fn({ caller, input }) };
    } catch (e) {
      if (e instanceof HttpError) return { ok: false, message: e.message, fieldErrors: e.fieldErrors };
      console.error("[action] unexpected error", e);
      return { ok: false, message: "Something went wrong on the server; nothing was changed." };
    }
  };
}
