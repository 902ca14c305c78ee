import type { DesignView } from "@/lib/design-view";

/** The saved requirement, choice, figures and charts of a design (built by the wizard feature). */
export function DesignFigures(_props: { design: DesignView }) {
  return null;
}
