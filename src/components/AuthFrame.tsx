/**
 * The calm, centred frame of the account pages (sign in, sign up, reset,
 * invitation): a heading, a short line of context, the form, and links below.
 */
import type { ReactNode } from 'react';
import { Link } from 'react-router';

export function AuthFrame({ title, lead, children, footer }: { title: string; lead?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  return (
    <div className="flex flex-1 items-start justify-center overflow-auto bg-gradient-to-b from-lavender-50 to-foam px-6 py-16">
      <div className="w-form">
        <div className="card p-7 shadow-float">
          <h1 className="text-title text-tide-900">{title}</h1>
          {lead && <p className="mt-1.5 text-sm text-tide-700">{lead}</p>}
          <div className="mt-5">{children}</div>
        </div>
        {footer && <div className="mt-4 space-y-1 text-center text-sm text-tide-700">{footer}</div>}
        <p className="mt-8 text-center text-caption text-tide-600">
          <Link to="/dev/outbox" className="underline decoration-tide-300 underline-offset-2 hover:text-tide-800">
            Development outbox
          </Link>
        </p>
      </div>
    </div>
  );
}

/** A link styled for the account pages. */
export function AuthLink({ to, children }: { to: string; children: ReactNode }) {
  return (
    <Link to={to} className="font-medium text-lavender-700 underline decoration-lavender-300 underline-offset-2 hover:text-lavender-900">
      {children}
    </Link>
  );
}
