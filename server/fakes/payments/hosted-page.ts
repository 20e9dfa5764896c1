/**
 * The fake's stand-in for the provider's hosted payment page: a plain form
 * of our own design showing what is being bought, a card number field
 * (4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined, as in the
 * provider's published test cards) and Pay / Cancel buttons. No script.
 */
import type { FakeCheckoutSession } from './state.ts';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] ?? c);

/** Amount in minor units as a decimal string (0 decimals for zero-decimal currencies). */
function amountText(amount: number, currency: string): string {
  const zeroDecimal = ['jpy', 'krw', 'vnd', 'clp', 'isk', 'pyg', 'ugx', 'xaf', 'xof'].includes(currency);
  const digits = String(amount).padStart(zeroDecimal ? 1 : 3, '0');
  const text = zeroDecimal ? digits : `${digits.slice(0, -2)}.${digits.slice(-2)}`;
  return `${text} ${currency.toUpperCase()}`;
}

const STYLE = `
body{margin:0;font-family:system-ui,sans-serif;background:#f4f1ea;color:#1f2a30}
main{max-width:26rem;margin:3rem auto;background:#fff;border:1px solid #d8d2c4;border-radius:10px;padding:1.75rem}
h1{font-size:1.1rem;margin:0 0 .25rem}
.muted{color:#5b6870;font-size:.85rem;margin:0}
.total{font-size:1.6rem;font-weight:600;margin:1.25rem 0}
label{display:block;font-size:.85rem;font-weight:600;margin:1rem 0 .3rem}
input{width:100%;box-sizing:border-box;font:inherit;padding:.55rem .6rem;border:1px solid #b9b2a3;border-radius:6px}
/* Pay comes first in the form so Enter pays; Cancel is drawn on the left. */
.row{display:flex;flex-direction:row-reverse;gap:.6rem;margin-top:1.4rem}
button{font:inherit;font-weight:600;padding:.6rem 1rem;border-radius:6px;border:1px solid #3d4f5a;cursor:pointer}
.pay{background:#3d4f5a;color:#fff;flex:1}.cancel{background:#fff;color:#3d4f5a}
.error{background:#fbe9e7;border:1px solid #e0a89e;color:#8a2b1d;padding:.6rem .75rem;border-radius:6px;margin-top:1rem}
.banner{font-size:.75rem;letter-spacing:.04em;text-transform:uppercase;color:#7a5b00;background:#fff4cc;padding:.35rem .6rem;border-radius:4px;display:inline-block;margin-bottom:1rem}
`;

/** The page for an open session; `error` is shown above the buttons (e.g. a declined card). */
export function hostedPageHtml(session: FakeCheckoutSession, error: string | null = null): string {
  const item = session.line_items_data[0];
  const name = item?.name ?? 'Your order';
  const body = session.status !== 'open'
    ? `<p class="error" role="alert">This payment page is no longer open (the session is ${escapeHtml(session.status)}).</p>`
    : `<form method="post" action="/pay/${encodeURIComponent(session.id)}">
  <label for="email">E-mail</label>
  <input id="email" name="email" type="email" value="${escapeHtml(session.customer_email ?? '')}" readonly>
  <label for="card">Card number</label>
  <input id="card" name="card" inputmode="numeric" autocomplete="off" value="4242 4242 4242 4242">
  <p class="muted">Local test payments: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined.</p>
  ${error ? `<p class="error" role="alert">${escapeHtml(error)}</p>` : ''}
  <div class="row">
    <button class="pay" type="submit" name="action" value="pay">Pay ${escapeHtml(amountText(session.amount_total, session.currency))}</button>
    <button class="cancel" type="submit" name="action" value="cancel" formnovalidate>Cancel</button>
  </div>
</form>`;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width,initial-scale=1">
<title>Pay for ${escapeHtml(name)}</title><style>${STYLE}</style></head>
<body><main>
<span class="banner">Local payment stand-in · no real money</span>
<h1>${escapeHtml(name)}</h1>
<p class="muted">${escapeHtml(item?.description ?? '')}</p>
<p class="total">${escapeHtml(amountText(session.amount_total, session.currency))}${item?.tax_behavior === 'inclusive' ? ' <span class="muted">incl. tax</span>' : ''}</p>
${body}
</main></body></html>`;
}
