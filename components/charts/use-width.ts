"use client";
// The width of a chart's container, so visx gets explicit sizes (see "Stack pitfalls" in
// docs/architecture.md): @visx/responsive measures the parent and follows it as it resizes.
import { useParentSize } from "@visx/responsive";

/**
 * The container (ref it), the element once mounted, and its whole-pixel width: 0 until measured.
 * A chart draws nothing (or a blank of its own height) at 0, never at a guessed width, so a phone
 * never sees a desktop-wide chart before its frame is measured.
 */
export function useWidth<T extends HTMLElement>() {
  const { parentRef, node, width } = useParentSize<T>({
    initialSize: { width: 0 },
    debounceTime: 50,
    enableDebounceLeadingCall: true,
    ignoreDimensions: ["height", "top", "left"],
  });
  return { ref: parentRef, node, width: Math.floor(width) };
}
