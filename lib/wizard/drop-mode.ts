// The allowed drop is given in volts or as a share of the supply; switching converts the value
// (60 mV of a 3 V supply is 2 %) so the requirement stays the same. Nothing to convert → null.
import { parseQuantity } from "@/lib/design/units";
import type { WizardValues } from "./form-values";

const figures = (x: number) => String(Number(x.toPrecision(4)));

export function convertDrop(values: WizardValues, to: "volts" | "share"): string | null {
  const supply = parseQuantity(values.supply?.voltage ?? "", "voltage");
  if (!supply.ok || supply.value <= 0) return null;
  if (to === "share") {
    const drop = parseQuantity(values.drop?.max ?? "", "voltage");
    if (!drop.ok) return null;
    return `${figures((100 * drop.value) / supply.value)} %`;
  }
  const share = parseQuantity(values.drop?.fraction ?? "", "fraction");
  if (!share.ok) return null;
  const volts = share.value * supply.value;
  const milli = Math.abs(volts) < 1;
  return `${figures(milli ? volts * 1e3 : volts)} ${milli ? "mV" : "V"}`;
}
