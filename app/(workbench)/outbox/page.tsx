import type { Metadata } from "next";
import { EmptyState, Panel } from "@/components/ui/panel";
import { listTeamMail } from "@/db/queries/mail";
import { requirePageCaller } from "@/lib/auth/gate";
import { can } from "@/lib/auth/policy";
import { formatWhen } from "@/lib/saved-designs/when";
import { usesOutbox } from "@/lib/mail/transport";

export const metadata: Metadata = { title: "Outbox" };

export default async function OutboxPage() {
  const caller = await requirePageCaller("/outbox");
  if (!can(caller, "team.read-outbox")) {
    return (
      <EmptyState title="Only owners read the outbox">
        The outbox shows every mail the workbench sent for the team; ask an owner.
      </EmptyState>
    );
  }
  if (!usesOutbox()) {
    return (
      <EmptyState title="Mail goes out through your SMTP server">
        SMTP_URL is set, so messages are delivered for real and there is no local outbox. Check that server&apos;s
        mailboxes.
      </EmptyState>
    );
  }
  const messages = await listTeamMail(caller.teamId);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-lg font-semibold">Outbox</h1>
        <p className="text-ink-muted">
          No SMTP server is configured (SMTP_URL is unset), so the built-in outbox keeps every message the workbench
          sends for {caller.teamName}. Newest first.
        </p>
      </div>
      {messages.length === 0 ? (
        <EmptyState title="No mail yet">
          Submitting a design, a verdict, a comment or an invitation sends one.
        </EmptyState>
      ) : (
        <ul className="flex flex-col gap-3" data-testid="outbox">
          {messages.map((m) => (
            <li key={m.id}>
              <Panel
                title={<span className="normal-case tracking-normal text-ink">{m.subject}</span>}
                actions={<span className="text-xs text-ink-muted num">{formatWhen(m.sentAt)}</span>}
              >
                <p className="mb-2 text-xs text-ink-muted">
                  To <span className="font-mono text-ink">{m.to}</span> · from{" "}
                  <span className="font-mono">{m.from}</span>
                </p>
                <pre className="whitespace-pre-wrap break-words font-sans text-sm" data-testid="outbox-text">
                  {m.text}
                </pre>
              </Panel>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
