"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";

import type { ApiError } from "@/lib/api-description/responses";
export type SendState = { busy: boolean; error: string | null; stale: boolean; ok: string | null };

/** POST/PATCH JSON to the API; a 409 is reported as "someone else changed it" with a reload offer. */
export function useSend() {
  const router = useRouter();
  const [state, setState] = useState<SendState>({ busy: false, error: null, stale: false, ok: null });
  async function send(
    url: string,
    method: "POST" | "PATCH",
    body: unknown,
    okText: string | ((answer: Record<string, unknown>) => string),
  ): Promise<boolean> {
    setState({ busy: true, error: null, stale: false, ok: null });
    try {
      const res = await fetch(url, {
        method,
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      });
      const data = (await res.json().catch(() => ({}))) as Partial<ApiError>;
      if (!res.ok) {
        const detail = data.fieldErrors
          ? Object.entries(data.fieldErrors)
              .map(([k, v]) => `${k}: ${v.join("; ")}`)
              .join(" · ")
          : "";
        setState({
          busy: false,
          stale: res.status === 409,
          ok: null,
          error: `${data.message ?? `The server refused (${res.status}).`}${detail && !data.message?.includes(detail) ? ` (${detail})` : ""}`,
        });
        return false;
      }
      setState({
        busy: false,
        error: null,
        stale: false,
        ok: typeof okText === "string" ? okText : okText(data as Record<string, unknown>),
      });
      router.refresh();
      return true;
    } catch {
      setState({ busy: false, error: "The server could not be reached; nothing was changed.", stale: false, ok: null });
      return false;
    }
  }
  return {
    ...state,
    send,
    reload: () => {
      setState({ busy: false, error: null, stale: false, ok: null });
      router.refresh();
    },
  };
}
