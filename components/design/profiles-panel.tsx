import type { DesignView, DesignViewer } from "@/lib/design-view";

/** Current-profile uploads and their evaluation (built by the uploads feature). */
export function ProfilesPanel(_props: { design: DesignView; viewer: DesignViewer }) {
  return null;
}
