"use client";
// The width of a chart's container, so visx gets explicit sizes (see "Stack pitfalls" in
// docs/architecture.md): @visx/responsive measures the parent and follows it as it resizes.
import { useParentSize } from "@visx/responsive";

/** The container (ref it), the element once mounted, and its whole-pixel width: 0 until measured. */
export function useWidth<T extends HTMLElement>(initial = 0) {
  const { parentRef, node, width } = useParentSize<T>({
    initialSize: { width: initial },
    debounceTime: 50,
    enableDebounceLeadingCall: true,
    ignoreDimensions: ["height", "top", "left"],
  });
  return { ref: parentRef, node, width: Math.floor(width) };
}
