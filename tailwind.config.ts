import type { Config } from "tailwindcss";

// Sensewright's own palette: ink neutrals, a copper accent (the colour of a bare shunt),
// a signal teal for data, and plain status colours. Colours come from CSS variables so dark mode is one switch.
const v = (name: string) => `rgb(var(--sw-${name}) / <alpha-value>)`;

const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}", "./lib/**/*.{ts,tsx}"],
  darkMode: "media",
  theme: {
    extend: {
      colors: {
        canvas: v("canvas"),
        panel: v("panel"),
        sunken: v("sunken"),
        line: v("line"),
        ink: { DEFAULT: v("ink"), muted: v("ink-muted"), faint: v("ink-faint") },
        copper: { DEFAULT: v("copper"), strong: v("copper-strong"), soft: v("copper-soft") },
        signal: { DEFAULT: v("signal"), soft: v("signal-soft") },
        good: v("good"),
        warn: v("warn"),
        bad: v("bad"),
      },
      fontFamily: {
        sans: ["var(--font-sans)", "ui-sans-serif", "system-ui", "sans-serif"],
        mono: ["ui-monospace", "SFMono-Regular", "Menlo", "monospace"],
      },
      fontSize: { "2xs": ["0.6875rem", { lineHeight: "1rem" }] },
      borderRadius: { panel: "0.375rem" },
    },
  },
};

export default config;
