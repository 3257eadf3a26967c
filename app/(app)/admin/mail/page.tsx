import type { Metadata } from "next";
import { attemptLines } from "@/lib/mail/attempt-log";
import Link from "next/link";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { cardClass, tableClass, tdClass, thClass } from "@/components/ui/styles";
import type { CaughtMail } from "@/db/schema";
import { requirePermission } from "@/lib/auth/authorize";
import { pageGuard } from "@/lib/auth/page-guard";
import { requireUser } from "@/lib/auth/session";
import { mailRoute } from "@/lib/mail/transport";
import { getCaughtMail, listCaughtMail, listOutbox, type CaughtMailSummary, type OutboxSummary } from "@/lib/services/mail";
import { formatInTimeZone } from "@/lib/time-format";
import { defaultTimeZone } from "@/lib/time-zone-config";

export const metadata: Metadata = { title: "Mail" };

const when = (date: Date) => formatInTimeZone(date, defaultTimeZone(), { precision: "second" });

function RouteNotice() {
  const route = mailRoute();
  const where = route.port ? `${route.host}:${route.port}` : route.host;
  return (
    <p data-testid="mail-route" className="mb-6 rounded-md border border-slate-200 bg-slate-50 px-4 py-3 text-sm dark:border-slate-700 dark:bg-slate-800/50">
      {route.kind === "local" ? (
        <>
          Mail goes to the <strong>local catcher</strong> on {where}: nothing leaves this machine, and every message shows below.
          Set <code>SMTP_URL</code> to send through a real relay.
        </>
      ) : (
        <>
          Mail goes to the <strong>relay {where}</strong> (from <code>SMTP_URL</code>); the local catcher is off. The outbox below shows what
          was sent and what is stuck.
        </>
      )}
    </p>
  );
}

function CaughtList({ messages, openId }: { messages: CaughtMailSummary[]; openId: number | null }) {
  return (
    <ul className={`${cardClass} h-fit divide-y divide-slate-100 overflow-hidden dark:divide-slate-800`} aria-label="Caught messages">
      {messages.map((m) => (
        <li key={m.id}>
          <Link
            href={`/admin/mail?message=${m.id}`}
            aria-current={m.id === openId ? "true" : undefined}
            className="block px-3 py-2 hover:bg-slate-50 aria-[current=true]:bg-accent/10 dark:hover:bg-slate-800"
            data-testid="caught-mail"
          >
            <span className="block truncate text-sm font-medium">{m.subject || "(no subject)"}</span>
            <span className="block truncate text-xs text-slate-500 dark:text-slate-400">
              to {m.envelopeTo.join(", ")} · {when(m.receivedAt)}
            </span>
          </Link>
        </li>
      ))}
    </ul>
  );
}

function CaughtDetail({ message }: { message: CaughtMail }) {
  return (
    <article className={`${cardClass} min-w-0 space-y-4 p-4`} aria-label="Message">
      <div>
        <h2 className="text-lg font-semibold">{message.subject || "(no subject)"}</h2>
        <p className="text-sm text-slate-600 dark:text-slate-400">
          from {message.envelopeFrom ?? "(none)"} to {message.envelopeTo.join(", ")} · received {when(message.receivedAt)} ·{" "}
          {message.rawSize.toLocaleString("en-US")} bytes
        </p>
        {message.attachments.length > 0 && (
          <p className="text-sm">Attachments: {message.attachments.map((a) => `${a.filename ?? "unnamed"} (${a.contentType}, ${a.size} bytes)`).join(", ")}</p>
        )}
      </div>
      <section>
        <h3 className="mb-1 text-sm font-semibold">Plain text</h3>
        <pre data-testid="mail-text" className="max-h-96 overflow-auto whitespace-pre-wrap break-words rounded-md bg-slate-50 p-3 font-mono text-xs dark:bg-slate-800">
          {message.text ?? "(no plain-text part)"}
        </pre>
      </section>
      <section>
        <h3 className="mb-1 text-sm font-semibold">HTML</h3>
        {message.html ? (
          // sandbox="" runs no script and treats the message as a foreign origin: mail HTML never touches this page.
          <iframe title="HTML part" sandbox="" srcDoc={message.html} className="h-[28rem] w-full rounded-md border border-slate-200 bg-white dark:border-slate-700" />
        ) : (
          <p className="text-sm text-slate-500">(no HTML part)</p>
        )}
      </section>
    </article>
  );
}

const STATE_CLASS: Record<OutboxSummary["state"], string> = {
  queued: "text-amber-700 dark:text-amber-300",
  sending: "text-accent",
  sent: "text-emerald-700 dark:text-emerald-300",
  failed: "font-medium text-critical",
};

function OutboxTable({ rows }: { rows: OutboxSummary[] }) {
  return (
    <div className={`${cardClass} overflow-x-auto`}>
      <table className={tableClass}>
        <thead>
          <tr>
            <th className={thClass}>To</th>
            <th className={thClass}>Message</th>
            <th className={thClass}>State</th>
            <th className={thClass}>Attempts</th>
            <th className={thClass}>Attempts, oldest first</th>
          </tr>
        </thead>
        <tbody className="divide-y divide-slate-100 dark:divide-slate-800">
          {rows.map((row) => (
            <tr key={row.id} data-testid="outbox-row">
              <td className={tdClass}>{row.toAddress}</td>
              <td className={tdClass}>
                <p>{row.subject}</p>
                <p className="text-xs text-slate-500 dark:text-slate-400">
                  {row.kind} · queued {when(row.createdAt)}
                </p>
              </td>
              <td className={`${tdClass} whitespace-nowrap`}>
                <span className={STATE_CLASS[row.state]}>{row.state}</span>
                <span className="block text-xs text-slate-500 dark:text-slate-400">
                  {row.state === "sent" && row.sentAt ? when(row.sentAt) : row.state === "queued" ? `next try ${when(row.nextAttemptAt)}` : ""}
                </span>
              </td>
              <td className={tdClass}>{row.attempts}</td>
              <td className={`${tdClass} max-w-sm break-words text-xs`}>
                {row.attemptLog?.length ? (
                  <ol className="list-decimal space-y-0.5 pl-4" data-testid="attempt-history">
                    {attemptLines(row.attemptLog, (iso) => when(new Date(iso))).map((line, index) => (
                      <li key={index}>{line}</li>
                    ))}
                  </ol>
                ) : (
                  "Not tried yet."
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

export default async function MailPage({ searchParams }: { searchParams: Promise<{ message?: string }> }) {
  const me = await requireUser();
  await pageGuard(requirePermission(me, "mail:read"));
  const openId = Number((await searchParams).message) || null;
  const [caught, outbox, open] = await Promise.all([listCaughtMail(me), listOutbox(me), openId ? getCaughtMail(me, openId) : null]);
  return (
    <>
      <PageHeader title="Mail" subtitle="Every e-mail the app sends goes through the outbox; a background job delivers it and retries when the relay is down." />
      <RouteNotice />
      <h2 className="mb-3 text-lg font-semibold">Caught by the local catcher</h2>
      {caught.length === 0 ? (
        <EmptyState title="No mail caught yet">
          <p>Invitations, password resets and alerts show here a few seconds after they are queued.</p>
        </EmptyState>
      ) : (
        <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
          <CaughtList messages={caught} openId={open?.id ?? null} />
          {open ? (
            <CaughtDetail message={open} />
          ) : (
            <EmptyState title="Choose a message">
              <p>Its plain text and its HTML open here.</p>
            </EmptyState>
          )}
        </div>
      )}
      <h2 className="mb-3 mt-8 text-lg font-semibold">Outbox</h2>
      {outbox.length === 0 ? (
        <EmptyState title="The outbox is empty">
          <p>Nothing has been queued for sending yet.</p>
        </EmptyState>
      ) : (
        <OutboxTable rows={outbox} />
      )}
    </>
  );
}
