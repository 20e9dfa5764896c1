/**
 * Development outbox: the e-mails the local fake SMTP server caught
 * (invitations, password resets), newest first, with their links clickable.
 * The API serves it only in development and tests.
 */
import { useState } from 'react';
import { useOutbox } from '../api/useOutbox';
import { errorText, isApiStatus } from '../api/client';
import { fullTime, relativeTime } from '../components/format';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';

/** A link from a mail, shown as an in-app path when it points at this site. */
function linkLabel(href: string): string {
  try {
    const u = new URL(href, window.location.origin);
    return u.origin === window.location.origin ? u.pathname + u.search : href;
  } catch {
    return href;
  }
}

export function Component() {
  const outbox = useOutbox();
  const [openId, setOpenId] = useState<string | null>(null);
  const messages = [...(outbox.data ?? [])].sort((a, b) => Date.parse(b.receivedAt) - Date.parse(a.receivedAt));

  return (
    <div className="flex-1 overflow-auto">
      <div className="mx-auto max-w-4xl px-8 py-8">
        <h1 className="text-title text-tide-900">Development outbox</h1>
        <p className="mt-1 text-sm text-tide-700">
          E-mails sent while running locally land here instead of leaving the machine. It refreshes every few seconds.
        </p>
        <div className="mt-6">
          {outbox.isPending ? (
            <Loading label="Loading the outbox…" />
          ) : outbox.isError ? (
            <Notice tone="error">
              {isApiStatus(outbox.error, 404) ? 'The outbox exists only when Loopwright runs in development or test mode.' : errorText(outbox.error)}
            </Notice>
          ) : messages.length === 0 ? (
            <div className="card px-8 py-12 text-center text-sm text-tide-700">
              No e-mails yet. Ask for a password reset or invite someone to a pattern, and the message appears here.
            </div>
          ) : (
            <ul className="space-y-3">
              {messages.map((m) => {
                const id = String(m.id);
                const open = openId === id;
                return (
                  <li key={id} className="card p-4">
                    <div className="flex items-baseline justify-between gap-4">
                      <h2 className="text-sm font-semibold text-tide-900">{m.subject || '(no subject)'}</h2>
                      <span className="shrink-0 text-caption text-tide-600" title={fullTime(m.receivedAt)}>{relativeTime(m.receivedAt)}</span>
                    </div>
                    <p className="mt-0.5 text-caption text-tide-700">To {m.to}</p>
                    {m.links.length > 0 && (
                      <ul className="mt-3 space-y-1" aria-label="Links in this message">
                        {m.links.map((href) => (
                          <li key={href}>
                            <a href={href} className="break-all font-mono text-caption text-lavender-700 underline underline-offset-2 hover:text-lavender-900">
                              {linkLabel(href)}
                            </a>
                          </li>
                        ))}
                      </ul>
                    )}
                    <button type="button" className="mt-3 text-caption font-medium text-tide-700 underline" aria-expanded={open}
                      onClick={() => setOpenId(open ? null : id)}>
                      {open ? 'Hide message' : 'Show message'}
                    </button>
                    {open && <pre className="mt-2 whitespace-pre-wrap rounded-stitch bg-tide-50 p-3 font-sans text-caption text-tide-800">{m.text}</pre>}
                  </li>
                );
              })}
            </ul>
          )}
        </div>
      </div>
    </div>
  );
}
