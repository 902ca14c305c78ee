// The one gate every route handler, server action and signed-in page goes through:
// it reads the session, re-reads the caller's membership (the role lives only there),
// checks the role, and parses the input with zod.
import "server-only";
import { getServerSession } from "next-auth";
import { notFound, redirect } from "next/navigation";
import { cache } from "react";
import type { z } from "zod";
import { getMember } from "@/db/queries/users";
import type { Role } from "@/db/schema";
import { HttpError, errorResponse, invalid, json } from "@/lib/http";
import { authOptions } from "./options";

export type Caller = {
  userId: string;
  email: string;
  name: string;
  teamId: string;
  teamName: string;
  role: Role;
};

type SessionShape = { userId?: string; teamId?: string } | null;

/** The signed-in caller, or null. */
export async function currentCaller(): Promise<Caller | null> {
  const session = (await getServerSession(authOptions)) as SessionShape;
  if (!session?.userId || !session.teamId) return null;
  return getMember(session.userId, session.teamId);
}

const roleNames: Record<Role, string> = {
  owner: "owners",
  designer: "designers",
  reviewer: "reviewers",
  maker: "makers",
};

export function describeRoles(roles: readonly Role[]): string {
  const names = roles.map((r) => roleNames[r]);
  return names.length <= 1 ? (names[0] ?? "nobody") : `${names.slice(0, -1).join(", ")} and ${names.at(-1)}`;
}

export function assertRole(caller: Caller, roles: readonly Role[] | undefined, doing: string) {
  if (roles && !roles.includes(caller.role)) {
    throw new HttpError(403, `Only ${describeRoles(roles)} may ${doing}; you are signed in as a ${caller.role}.`);
  }
}

const MAX_JSON_BYTES = 1_000_000;

async function readJson(request: Request): Promise<unknown> {
  const length = Number(request.headers.get("content-length") ?? "0");
  if (length > MAX_JSON_BYTES) throw new HttpError(413, "The request body is larger than 1 MB.");
  const text = await request.text();
  if (text.length > MAX_JSON_BYTES) throw new HttpError(413, "The request body is larger than 1 MB.");
  if (!text.trim()) return {};
  try {
    return JSON.parse(text);
  } catch {
    throw new HttpError(422, "The request body is not valid JSON.", { "(body)": ["is not valid JSON"] });
  }
}

type RouteContext = { params: Promise<Record<string, string | string[]>> };

type Options<B, Q> = {
  /** Roles allowed; omit for any team member. */
  roles?: readonly Role[];
  /** What the caller is trying to do, for the 403 message ("save designs"). */
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
      const caller = await currentCaller();
      if (!caller) throw new HttpError(401, "Sign in first.");
      assertRole(caller, options.roles, options.doing ?? "do this");
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

const pageCaller = cache(currentCaller);

/**
 * For signed-in pages: redirects to /sign-in when signed out, answers the not-found page to a
 * role outside `roles`. Wrapped in React's cache(), with the session read cached on its own, so
 * a layout and its page share one session and membership read per request.
 */
export const requirePageCaller = cache(async (next?: string, roles?: readonly Role[]): Promise<Caller> => {
  const caller = await pageCaller();
  if (!caller) redirect(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  if (roles && !roles.includes(caller.role)) notFound();
  return caller;
});

export type ActionResult<T> =
  { ok: true; data: T } | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/** Wraps a server action the same way apiRoute wraps a route. */
export function serverAction<I, T>(
  options: { roles?: readonly Role[]; doing?: string; input: z.ZodType<I> },
  fn: (ctx: { caller: Caller; input: I }) => Promise<T>,
) {
  return async (raw: unknown): Promise<ActionResult<T>> => {
    try {
      const caller = await currentCaller();
      if (!caller) throw new HttpError(401, "Sign in first.");
      assertRole(caller, options.roles, options.doing ?? "do this");
      const input = parseWith(options.input, raw);
      return { ok: true, data: await fn({ caller, input }) };
    } catch (e) {
      if (e instanceof HttpError) return { ok: false, message: e.message, fieldErrors: e.fieldErrors };
      console.error("[action] unexpected error", e);
      return { ok: false, message: "Something went wrong on the server; nothing was changed." };
    }
  };
}
