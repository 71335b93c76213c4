import type { Metadata } from 'next';
import { requirePageRole } from '@/lib/auth/page-guard';
import { listOutbox } from '@/lib/data/outbox';

export const metadata: Metadata = { title: 'Outbox' };

export default async function OutboxPage() {
  const actor = await requirePageRole('admin', '/admin/outbox');
  const messages = await listOutbox(actor, 100);
  return (
    <div className="space-y-6">
      <h1 className="page-title">Outbox</h1>
      <p className="text-stone-700">
        Mail caught by the local mail fake (development and demo). In production mail goes to the configured SMTP server instead.
      </p>
      {messages.length === 0 ? <p className="card">No messages yet.</p> : null}
      <ul className="space-y-4" data-testid="outbox">
        {messages.map((m) => (
          <li key={m.id} className="card space-y-2" data-testid="outbox-message">
            <div className="flex flex-wrap justify-between gap-2 text-sm text-stone-600">
              <span>To: {m.to.join(', ')}</span>
              <time dateTime={m.receivedAt}>{m.receivedAt.replace('T', ' ').slice(0, 16)} UTC</time>
            </div>
            <h2 className="text-lg">{m.subject}</h2>
            <div className="grid gap-3 lg:grid-cols-2">
              <div className="min-w-0">
                <h3 className="mb-1 text-sm font-semibold text-stone-800">As formatted (HTML part)</h3>
                {m.html ? (
                  // Sandboxed with no permissions: no scripts, no forms, no same-origin access.
                  <iframe
                    sandbox=""
                    title={`HTML part of “${m.subject}” to ${m.to.join(', ')}`}
                    srcDoc={m.html}
                    loading="lazy"
                    className="h-96 w-full rounded border border-stone-300 bg-white"
                    data-testid="outbox-html"
                  />
                ) : (
                  <p className="text-sm text-stone-700">No HTML part.</p>
                )}
              </div>
              <div className="min-w-0">
                <h3 className="mb-1 text-sm font-semibold text-stone-800">Plain text part</h3>
                <pre
                  className="max-h-96 overflow-auto whitespace-pre-wrap break-words rounded border border-stone-300 bg-stone-50 p-3 font-sans text-sm text-stone-800"
                  data-testid="outbox-text"
                >
                  {m.text}
                </pre>
              </div>
            </div>
          </li>
        ))}
      </ul>
    </div>
  );
}
