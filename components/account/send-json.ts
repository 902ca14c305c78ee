// One JSON request from the account page's forms, with the API's refusal kept whole
// ({ message, fieldErrors }) so each form can show it beside the field it names.
import type { ApiError } from "@/lib/api-description/responses";

export type Refusal = Pick<ApiError, "message" | "fieldErrors">;

export async function sendJson<T>(
  url: string,
  method: "POST" | "PATCH" | "PUT" | "DELETE",
  body?: unknown,
): Promise<{ ok: true; data: T } | { ok: false; refusal: Refusal }> {
  try {
    const res = await fetch(url, {
      method,
      headers: body === undefined ? undefined : { "content-type": "application/json" },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const data = (await res.json().catch(() => null)) as (T & Partial<Refusal>) | null;
    if (res.ok) return { ok: true, data: data as T };
    return {
      ok: false,
      refusal: {
        message: data?.message ?? `The server refused (${res.status}); nothing was changed.`,
        fieldErrors: data?.fieldErrors,
      },
    };
  } catch {
    return { ok: false, refusal: { message: "The server could not be reached; nothing was changed." } };
  }
}
