// The sheet's colours (the app's palette, from app/globals.css) and the families its own labels use.
export { LABEL_FONTS } from "../fonts";

export const colors = {
  ink: "#1c1e21",
  muted: "#5d6168",
  faint: "#8b8f96",
  line: "#dbdad3",
  sunken: "#f4f3ef",
  copper: "#b0602c",
  copperSoft: "#f6e5d6",
  signal: "#127a80",
  bad: "#ba2c2c",
  badSoft: "#f8e1e1",
  good: "#2f7d32",
};
