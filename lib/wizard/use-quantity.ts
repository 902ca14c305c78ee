"use client";
// A typed quantity read by the engine's parser in the check worker: null until the worker answers,
// and when the text is not a quantity of that dimension.
import { useEffect, useState } from "react";
import type { Dimension } from "@/lib/design/units";
import { check } from "./checker";

/** The SI value of `text`, or null (also while it is being read). */
export async function readQuantity(text: unknown, dim: Dimension): Promise<number | null> {
  if (typeof text !== "string" && typeof text !== "number") return null;
  const r = await check({ kind: "quantity", input: text, dim });
  return r.ok ? r.value : null;
}

export function useQuantity(text: unknown, dim: Dimension): number | null {
  const [read, setRead] = useState<{ text: unknown; value: number | null } | null>(null);
  useEffect(() => {
    let live = true;
    void readQuantity(text, dim).then((value) => live && setRead({ text, value }));
    return () => {
      live = false;
    };
  }, [text, dim]);
  // An answer for older text is not shown against newer text.
  return read && read.text === text ? read.value : null;
}
