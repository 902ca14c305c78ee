// How the build sheet, the parts CSV and the panel write numbers: always through the engine's
// formatSI / formatPercent, so a figure reads the same on paper and on screen.
import { formatPercent, formatSI } from "@/lib/design/format";

export const ohms = (v: number) => formatSI(v, "Ω");
export const volts = (v: number) => formatSI(v, "V");
export const amps = (v: number) => formatSI(v, "A");
export const watts = (v: number) => formatSI(v, "W");
export const hertz = (v: number) => formatSI(v, "Hz");
export const kelvin = (v: number) => formatSI(v, "K");
export const celsius = (v: number) => formatSI(v, "°C");
/** A percentage given in percent (3.5 → "3.5 %"). */
export const percent = (pct: number) => (pct > 0 && pct < 0.001 ? "below 0.001 %" : formatPercent(pct / 100));
/** A fraction as a percentage (0.005 → "0.5 %"). */
export const fraction = (ratio: number) => formatPercent(ratio);
export const gain = (g: number) => formatSI(g, "V/V", 4);
export const transimpedance = (vPerA: number) => formatSI(vPerA, "V/A");

/** A tempco or drift per kelvin in ppm/K (50e-6 → "50 ppm/K"). */
export function ppmPerK(perK: number): string {
  const ppm = perK * 1e6;
  return ppm >= 1 || ppm === 0 ? formatSI(ppm, "ppm/K") : formatSI(perK, "/K");
}

/** Noise density; the sheet's typeface has no root sign, so the trade's "rtHz" spelling. */
export const noiseDensity = (vPerRtHz: number) => formatSI(vPerRtHz, "V/rtHz");

export const decibels = (db: number) => formatSI(db, "dB", 4);
export const farads = (v: number) => formatSI(v, "F");
export const seconds = (v: number) => formatSI(v, "s");
