import Link from "next/link";
import { choiceFields, planFieldInfo, requirementFields } from "@/lib/saved-designs/figures";
import { formatWhen } from "@/lib/saved-designs/when";
import type { AuditEvent } from "@/lib/api-description/responses";

/** "choice.shuntOhms" → "shunt", "requirement.current.max" → "maximum current", "plan.ranges.1.gain" → "range 2, gain". */
function changedLabel(path: string): string {
  const [group, ...rest] = path.split(".");
  const key = rest.join(".");
  const label =
    group === "choice"
      ? choiceFields[key]?.label
      : group === "plan"
        ? planFieldInfo(key)?.label
        : group === "requirement"
          ? requirementFields[key]?.label
          : path === "name"
            ? "Name"
            : path === "project"
              ? "Project"
              : undefined;
  return (label ?? path).toLowerCase();
}

export type AuditEntry = AuditEvent;

const partKind = (targetType: string | null) =>
  targetType === "library-shunt" ? "shunt family" : targetType === "library-amplifier" ? "amplifier" : "part";
const plural = (n: unknown, one: string, many: string) => `${String(n)} ${Number(n) === 1 ? one : many}`;

const words: Record<string, (d: Record<string, unknown>, e: AuditEntry) => string> = {
  "design.created": (d) => `created the design (revision ${String(d.revision ?? 1)})`,
  "design.revised": (d) =>
    `saved revision ${String(d.revision)}${
      Array.isArray(d.changed) && d.changed.length
        ? ` (changed ${d.changed
            .slice(0, 6)
            .map((c) => changedLabel(String(c)))
            .join(", ")}${d.changed.length > 6 ? "…" : ""})`
        : ""
    }`,
  "design.submitted": (d) => `submitted revision ${String(d.revision)} for review`,
  "design.approved": (d) => `approved revision ${String(d.revision)}`,
  "design.returned": (d) => `returned revision ${String(d.revision)}${d.reason ? `: “${String(d.reason)}”` : ""}`,
  "design.commented": (d) => `${d.reply ? "replied to a comment" : "commented"} on revision ${String(d.revision)}`,
  "mail.failed": (d) => `could not mail ${String(d.to)} (${String(d.kind)}): ${String(d.error)}`,
  "member.role-changed": (d) => `changed a role from ${String(d.from)} to ${String(d.to)}`,
  "member.removed": (d) => `removed ${String(d.email ?? "a member")} (${String(d.role ?? "")}) from the team`,
  "invitation.created": (d) =>
    `invited ${String(d.email)} as ${String(d.role)}${d.newTeam ? ` to found “${String(d.newTeam)}”` : ""}`,
  "invitation.revoked": (d) => `revoked the invitation of ${String(d.email)}`,
  "invitation.accepted": (d) => `accepted the invitation for ${String(d.email)} and joined as ${String(d.role)}`,
  "team.created": (d) => `started the team “${String(d.name)}” for ${String(d.firstOwner)}`,
  "sign-in.failed": (d) => `failed sign-in for ${String(d.email)} (${String(d.reason)})`,
  "invitation.refused": (d) =>
    `was refused accepting the invitation for ${String(d.email ?? "an unknown link")} (${String(d.reason)})`,
  "password.changed": () => "changed their password; every other session of theirs ended",

  "token.created": (d) => `created the ${String(d.access)} API token “${String(d.name)}”`,
  "token.revoked": (d) => `revoked the API token “${String(d.name)}”`,
  "account.updated": () => "changed their name or mail choices",
  "library.create": (d, e) => `added the ${partKind(e.targetType)} “${String(d.name)}” to the library`,
  "library.update": (d, e) => `changed the library ${partKind(e.targetType)} “${String(d.name)}”`,
  "library.delete": (d, e) => `removed the ${partKind(e.targetType)} “${String(d.name)}” from the library`,
  "library.import": (d, e) =>
    `imported ${partKind(e.targetType) === "amplifier" ? "amplifiers" : "shunt families"} into the library: ${plural(d.created ?? 0, "new part", "new parts")}, ${plural(d.updated ?? 0, "part", "parts")} updated`,
  "profile.upload": (d) =>
    `uploaded the current profile “${String(d.fileName)}”${d.samples !== undefined ? ` (${plural(d.samples, "sample", "samples")})` : ""}`,
  "profile.delete": (d) => `deleted the current profile “${String(d.fileName)}”`,
};

/** An event in words; one this list does not know yet still reads as words, never as its key. */
export function describeAudit(e: AuditEntry): string {
  return words[e.action]?.(e.details, e) ?? `recorded “${e.action.replace(/[.-]/g, " ")}”`;
}

/** Who did what, newest first. */
export function AuditTimeline({
  entries,
  empty = "Nothing recorded yet.",
  designNames,
}: {
  entries: AuditEntry[];
  empty?: string;
  /** For a team-wide log: names of the designs events point at, so each line says which design. */
  designNames?: Record<string, string>;
}) {
  if (entries.length === 0) return <p className="text-xs text-ink-faint">{empty}</p>;
  return (
    <ol className="flex flex-col gap-1 text-sm" data-testid="audit-timeline">
      {entries.map((e) => (
        // On a phone the time sits above the line; a long unbroken name wraps instead of widening the page.
        <li key={e.id} className="grid grid-cols-1 gap-x-3 sm:grid-cols-[9.5rem_minmax(0,1fr)]">
          <span className="text-xs text-ink-muted num">{formatWhen(e.at)}</span>
          <span className="min-w-0 [overflow-wrap:anywhere]">
            <span className="font-medium">{e.actorName ?? "Someone signed out"}</span> {describeAudit(e)}
            {designNames && e.targetType === "design" && e.targetId && (
              <>
                {" — "}
                <Link href={`/designs/${e.targetId}`} className="text-copper hover:underline">
                  {designNames[e.targetId] ?? "a removed design"}
                </Link>
              </>
            )}
          </span>
        </li>
      ))}
    </ol>
  );
}
