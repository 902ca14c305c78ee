import type { DesignView, DesignViewer } from "@/lib/design-view";

/** Build sheet download, parts list and bench check (built by the build-sheet feature). */
export function BuildSheetPanel(_props: { design: DesignView; viewer: DesignViewer }) {
  return null;
}
