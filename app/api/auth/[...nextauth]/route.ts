// next-auth's routes, behind two checks of our own: a sign-in from a throttled e-mail-and-address pair
// or address gets 429 with Retry-After before any password is hashed, and nothing here ends in a 500
// for bad input (a malformed body or callbackUrl is a 400).
import NextAuth from "next-auth";
import type { NextRequest } from "next/server";
import { clientAddress } from "@/lib/auth/client-address";
import { toErrorResponse } from "@/lib/auth/gate";
import { authOptions } from "@/lib/auth/options";
import { safeRedirectUrl } from "@/lib/auth/safe-redirect";
import { retryAfterSeconds, signInWaitMs, tryAgainIn } from "@/lib/auth/sign-in-throttle";
import { json } from "@/lib/http";

const handler = NextAuth(authOptions);

type Context = { params: Promise<{ nextauth: string[] }> };

/** The e-mail a credentials sign-in names, read the way next-auth reads the body (form or JSON). */
async function emailOf(request: Request): Promise<string> {
  const type = request.headers.get("content-type") ?? "";
  const body: unknown = type.includes("application/json")
    ? await request.json()
    : type.includes("application/x-www-form-urlencoded")
      ? Object.fromEntries(new URLSearchParams(await request.text()))
      : {};
  const email = (body as { email?: unknown } | null)?.email;
  return typeof email === "string" ? email.trim().toLowerCase().slice(0, 320) : "";
}

async function throttled(request: NextRequest): Promise<Response | null> {
  const wait = await signInWaitMs(await emailOf(request.clone()), clientAddress(request.headers));
  if (wait <= 0) return null;
  const message = tryAgainIn(wait);
  // `url` carries the message the way next-auth's client reads a refusal (`?error=`).
  const url = safeRedirectUrl(`/sign-in?error=${encodeURIComponent(message)}`, request.nextUrl.origin);
  return json({ message, url }, { status: 429, headers: { "Retry-After": String(retryAfterSeconds(wait)) } });
}

const CALLBACK_COOKIES = ["next-auth.callback-url", "__Secure-next-auth.callback-url"];

function parsesAsHttp(value: string, base: string): boolean {
  try {
    return /^https?:$/.test(new URL(value, base).protocol);
  } catch {
    return false;
  }
}

/**
 * next-auth answers a callbackUrl it cannot parse (a port of 99999) with a 500 before any of our
 * callbacks run; we answer 400 first, and drop such a value left in its cookie.
 */
function badCallbackUrl(request: NextRequest): Response | null {
  const base = request.nextUrl.origin;
  const param = request.nextUrl.searchParams.get("callbackUrl");
  const badCookies = CALLBACK_COOKIES.filter((name) => {
    const value = request.cookies.get(name)?.value;
    return value !== undefined && !parsesAsHttp(value, base);
  });
  if ((param === null || parsesAsHttp(param, base)) && badCookies.length === 0) return null;
  const response = json(
    {
      message: "callbackUrl is not a valid address on this app; it was ignored. Try again.",
      fieldErrors: { callbackUrl: ["is not a valid address on this app"] },
    },
    400,
  );
  for (const name of badCookies) response.headers.append("Set-Cookie", `${name}=; Path=/; Max-Age=0; SameSite=Lax`);
  return response;
}

async function guarded(request: NextRequest, context: Context): Promise<Response> {
  try {
    const badCallback = badCallbackUrl(request);
    if (badCallback) return badCallback;
    if (request.method === "POST" && request.nextUrl.pathname.endsWith("/callback/credentials")) {
      const refusal = await throttled(request);
      if (refusal) return refusal;
    }
    return await handler(request, context);
  } catch (e) {
    // Malformed input (a body that does not parse, a URL that does not) is the client's: 400.
    if (e instanceof SyntaxError || e instanceof TypeError) {
      console.warn("[auth] refused a malformed request:", e.message);
      return json({ message: "The sign-in service could not read that request; nothing was changed." }, 400);
    }
    return toErrorResponse(e);
  }
}

export { guarded as GET, guarded as POST };
