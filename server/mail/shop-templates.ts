/** The receipt mailed after a paid order (plain text and simple HTML). */
import { formatMoney, type CurrencyCode } from '../../shared/shop/money.ts';
import type { MailMessage } from './mailer.ts';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

/** Receipt for order `orderId`: what was bought, the amount (integer minor units), and where to open it. */
export function receiptMail(o: {
  to: string; name: string; orderId: number; title: string; designer: string; version: string;
  currency: CurrencyCode; amount: number; taxInclusive: boolean; paidAt: Date; link: string;
}): MailMessage {
  const amount = formatMoney(o.amount, o.currency);
  const tax = o.taxInclusive ? 'including tax' : 'tax not included';
  const lines = [
    `Hello ${o.name},`,
    `Thank you for buying "${o.title}" by ${o.designer}. It is in your Loopwright library now, and later releases of the pattern (errata) reach you at no charge.`,
    `Order ${o.orderId} · version ${o.version} · ${amount} (${tax}) · paid ${o.paidAt.toUTCString()}`,
  ];
  const footer = 'Keep this message as your receipt. If the pattern is refunded, it leaves your library.';
  return {
    to: o.to,
    subject: `Your receipt: ${o.title} (order ${o.orderId})`,
    text: `${lines.join('\n\n')}\n\nOpen it: ${o.link}\n\n${footer}\n`,
    html: `<!doctype html><html><body style="font-family:sans-serif;max-width:36em;line-height:1.5">
${lines.map((l) => `<p>${escapeHtml(l)}</p>`).join('\n')}
<p><a href="${escapeHtml(o.link)}">Open the pattern</a></p>
<p style="color:#666;font-size:90%">${escapeHtml(footer)}</p>
</body></html>`,
  };
}
