"use client";
// A tooltip that reads on any background (the chart theme's own is transparent) and goes away
// when the pointer leaves the chart or Escape is pressed, instead of lingering over the page.
import { Tooltip, TooltipContext } from "@visx/xychart";
import { useContext, useEffect, type ComponentProps } from "react";
import type { Palette } from "./palette";

export function tooltipStyle(p: Palette) {
  return {
    position: "absolute" as const,
    zIndex: 40,
    pointerEvents: "none" as const,
    background: p.panel,
    color: p.ink,
    border: `1px solid ${p.line}`,
    borderRadius: 4,
    padding: "6px 8px",
    boxShadow: "0 2px 8px rgb(0 0 0 / 0.18)",
    maxWidth: 260,
  };
}

/** Hides the open tooltip when the pointer leaves `frame` or Escape is pressed. */
function HideOnLeave({ frame }: { frame: HTMLElement | null }) {
  const ctx = useContext(TooltipContext);
  const hide = ctx?.hideTooltip;
  useEffect(() => {
    const el = frame;
    if (!el || !hide) return;
    const onKey = (e: KeyboardEvent) => e.key === "Escape" && hide();
    el.addEventListener("pointerleave", hide);
    window.addEventListener("keydown", onKey);
    return () => {
      el.removeEventListener("pointerleave", hide);
      window.removeEventListener("keydown", onKey);
    };
  }, [frame, hide]);
  return null;
}

export function ChartTooltip({
  palette,
  frame,
  ...props
}: ComponentProps<typeof Tooltip> & { palette: Palette; frame: HTMLElement | null }) {
  return (
    <>
      <HideOnLeave frame={frame} />
      <Tooltip {...props} style={tooltipStyle(palette)} />
    </>
  );
}
