"use client";
// Chart colours from the theme's CSS variables (globals.css), read once per mount so SVG
// attributes get concrete values in light and dark mode alike.
import { buildChartTheme } from "@visx/xychart";
import { useEffect, useState } from "react";

export type Palette = {
  ink: string;
  muted: string;
  faint: string;
  line: string;
  panel: string;
  copper: string;
  copperStrong: string;
  signal: string;
  good: string;
  warn: string;
  bad: string;
};

const light: Palette = {
  ink: "rgb(28 30 33)",
  muted: "rgb(82 86 92)",
  faint: "rgb(128 132 138)",
  line: "rgb(219 218 211)",
  panel: "rgb(255 255 253)",
  copper: "rgb(176 96 44)",
  copperStrong: "rgb(140 70 28)",
  signal: "rgb(18 122 128)",
  good: "rgb(34 128 74)",
  warn: "rgb(170 112 0)",
  bad: "rgb(186 44 44)",
};

const vars: Record<keyof Palette, string> = {
  ink: "ink",
  muted: "ink-muted",
  faint: "ink-faint",
  line: "line",
  panel: "panel",
  copper: "copper",
  copperStrong: "copper-strong",
  signal: "signal",
  good: "good",
  warn: "warn",
  bad: "bad",
};

export function usePalette(): Palette {
  const [p, setP] = useState(light);
  useEffect(() => {
    const style = getComputedStyle(document.documentElement);
    const read = () =>
      setP(
        Object.fromEntries(
          Object.entries(vars).map(([k, v]) => {
            const raw = style.getPropertyValue(`--sw-${v}`).trim();
            return [k, raw ? `rgb(${raw})` : light[k as keyof Palette]];
          }),
        ) as Palette,
      );
    read();
    const mq = window.matchMedia("(prefers-color-scheme: dark)");
    mq.addEventListener("change", read);
    return () => mq.removeEventListener("change", read);
  }, []);
  return p;
}

export function chartTheme(p: Palette) {
  return buildChartTheme({
    // Also the tooltips' background: transparent left their text floating over the plot.
    backgroundColor: p.panel,
    colors: [p.signal, p.copper, p.good, p.warn, p.bad, p.muted],
    gridColor: p.line,
    gridColorDark: p.faint,
    tickLength: 4,
    svgLabelSmall: { fill: p.muted, fontSize: 10, fontFamily: "inherit" },
    svgLabelBig: { fill: p.muted, fontSize: 11, fontFamily: "inherit" },
  });
}

/** A shade of the signal colour for position t in 0..1 (light to deep). */
export function shade(p: Palette, t: number): string {
  const m = /rgb\((\d+)\s+(\d+)\s+(\d+)\)/.exec(p.signal);
  const [r, g, b] = m ? [Number(m[1]), Number(m[2]), Number(m[3])] : [18, 122, 128];
  const k = 0.35 + 0.65 * Math.max(0, Math.min(1, t));
  return `rgb(${Math.round(r * k + 200 * (1 - k))} ${Math.round(g * k + 200 * (1 - k))} ${Math.round(b * k + 200 * (1 - k))})`;
}

/**
 * Error-budget colours, in bar order. The hues are the Okabe–Ito set (Okabe and Ito, "Color
 * Universal Design", 2008; the hex values recalled from memory), ordered so that each colour
 * differs from its neighbours in lightness too (WCAG relative-luminance contrast at least 1.3,
 * checked in palette.test.ts): lightness is what readers with any colour-vision deficiency still
 * see. Dark mode lightens the blue and swaps the near-black for a light grey. Past eight sources
 * the colours repeat striped.
 */
export const budgetColours = {
  light: ["#0072B2", "#E69F00", "#009E73", "#F0E442", "#D55E00", "#56B4E9", "#CC79A7", "#333333"],
  dark: ["#3A9AD9", "#E69F00", "#009E73", "#F0E442", "#D55E00", "#56B4E9", "#CC79A7", "#DDDDDD"],
} as const;

/** A CSS background for budget source `i`, following the page's colour scheme (light-dark()). */
export function budgetBackground(i: number): string {
  const n = budgetColours.light.length;
  const k = i % n;
  const colour = `light-dark(${budgetColours.light[k]}, ${budgetColours.dark[k]})`;
  return i < n ? colour : `repeating-linear-gradient(45deg, ${colour} 0 3px, light-dark(#ffffff, #1d1f22) 3px 5px)`;
}
