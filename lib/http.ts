// The API's error shape: { message, fieldErrors? } with 400, 401, 403, 404, 409, 413, 415, 422, 429 or 503.
import { z } from "zod";

export type FieldErrors = Record<string, string[]>;

export class HttpError extends Error {
  constructor(
    readonly status: 400 | 401 | 403 | 404 | 409 | 413 | 415 | 422 | 429 | 503,
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = "HttpError";
  }
}

export const notFound = (what = "That design") => new HttpError(404, `${what} was not found.`);
export const forbidden = (why: string) => new HttpError(403, why);

/** A JSON answer; API JSON holds a team's data, so no cache keeps it (next.config.ts says so too). */
export function json(data: unknown, init?: number | ResponseInit): Response {
  const options: ResponseInit = typeof init === "number" ? { status: init } : { ...init };
  const headers = new Headers(options.headers);
  if (!headers.has("cache-control")) headers.set("cache-control", "no-store");
  return Response.json(data, { ...options, headers });
}

export function errorResponse(error: HttpError): Response {
  return json(
    error.fieldErrors ? { message: error.message, fieldErrors: error.fieldErrors } : { message: error.message },
    error.status,
  );
}

/** Zod issues as dotted-path field errors ("current.max": ["…"]). */
export function toFieldErrors(error: z.ZodError, prefix = ""): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = [prefix, ...issue.path.map(String)].filter(Boolean).join(".") || "(body)";
    (out[key] ??= []).push(issue.message);
  }
  return out;
}

export function invalid(error: z.ZodError, prefix = ""): HttpError {
  const fieldErrors = toFieldErrors(error, prefix);
  const [path, messages] = Object.entries(fieldErrors)[0] ?? ["(body)", ["is invalid"]];
  return new HttpError(422, `Invalid input at ${path}: ${messages[0]}`, fieldErrors);
}
