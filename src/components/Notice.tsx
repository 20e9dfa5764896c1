/**
 * An inline message box. `tone` picks the colour: `error` (announced
 * assertively), `warning`, `info` or `success`.
 */
import type { ReactNode } from 'react';

const tones = {
  error: 'border-glasswort-200 bg-glasswort-50 text-glasswort-800',
  warning: 'border-mudflat-200 bg-mudflat-50 text-mudflat-800',
  info: 'border-lavender-200 bg-lavender-50 text-lavender-900',
  success: 'border-samphire-200 bg-samphire-50 text-samphire-800',
} as const;

export function Notice({ tone = 'info', children, className = '' }: { tone?: keyof typeof tones; children: ReactNode; className?: string }) {
  return (
    <div role={tone === 'error' ? 'alert' : 'status'} className={`rounded-stitch border px-3 py-2 text-sm ${tones[tone]} ${className}`}>
      {children}
    </div>
  );
}
