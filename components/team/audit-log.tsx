import { AuditTimeline, type AuditEntry } from "@/components/review/audit-timeline";
import { Panel } from "@/components/ui/panel";

/** The team's log for owners: every state change, role change, invitation and failed sign-in. */
export function TeamAuditLog({ entries, designNames }: { entries: AuditEntry[]; designNames: Record<string, string> }) {
  return (
    <Panel title="Team log">
      <AuditTimeline entries={entries} designNames={designNames} empty="Nothing recorded yet." />
    </Panel>
  );
}
