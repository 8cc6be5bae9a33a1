import { pageAccess } from "@/lib/auth/page";
import { PageHeader, NotAllowed } from "@/components/shell/page-header";
import { AdminTabs } from "@/components/admin/admin-tabs";
import { listOutbox } from "@/lib/mail/outbox";

export const metadata = { title: "Outbox" };
export const dynamic = "force-dynamic";

export default async function OutboxPage() {
  const access = await pageAccess("admin");
  if (!access.allowed) return <NotAllowed needed={access.needed} />;
  const messages = await listOutbox(100);
  return (
    <>
      <PageHeader title="Admin" lead="Mail the app has sent, as received by the local mail catcher. No mail leaves this machine." />
      <AdminTabs current="outbox" />
      {messages.length === 0 ? (
        <p className="rounded-lg border border-dashed border-rule bg-panel p-6 text-abyss-500">No mail yet.</p>
      ) : (
        <ul className="space-y-3" data-testid="outbox">
          {messages.map((m) => (
            <li key={m.id} className="rounded-lg border border-rule bg-panel p-4">
              <div className="flex flex-wrap justify-between gap-2 text-sm">
                <strong>{m.subject}</strong>
                <time className="text-abyss-500" dateTime={new Date(m.createdAt).toISOString()}>{new Date(m.createdAt).toISOString().replace("T", " ").slice(0, 19)} UTC</time>
              </div>
              <div className="mt-1 text-xs text-abyss-500">to {m.to} · from {m.from}</div>
              <pre className="mt-2 whitespace-pre-wrap break-words font-mono text-xs text-abyss-700">{m.text}</pre>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
