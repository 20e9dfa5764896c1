/**
 * The designer's sales: totals per pattern and month, every order (date,
 * buyer, version, amount, status) with a refund button for paid ones, a
 * CSV download, and links to the listing editor of each released pattern.
 */
import { useState } from 'react';
import { Link } from 'react-router';
import { formatMoney } from '../../shared/shop/money';
import type { ApiOrder } from '../../shared/shop/api';
import { errorText } from '../api/client';
import { usePatternList } from '../api/usePatterns';
import { useRefund, useSales } from '../api/useShop';
import { fullTime } from '../components/format';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { statusLabel } from '../components/StatusBadge';

const orderTones: Record<string, string> = {
  paid: 'bg-samphire-50 text-samphire-800 border-samphire-200',
  'refund-pending': 'bg-mudflat-50 text-mudflat-800 border-mudflat-200',
  refunded: 'bg-glasswort-50 text-glasswort-800 border-glasswort-200',
};

function OrderStatus({ status }: { status: string }) {
  return <span className={`inline-flex rounded-full border px-2 py-0.5 text-caption font-medium ${orderTones[status] ?? 'bg-tide-100 text-tide-700 border-tide-200'}`}>{statusLabel(status)}</span>;
}

/** Orders that were paid at some point; the others (abandoned, cancelled, failed checkouts) are hidden unless asked for. */
const PAID_ONCE: readonly string[] = ['paid', 'refund-pending', 'refunded'];

const monthName = (month: string) => new Date(`${month}-01T00:00:00Z`).toLocaleDateString(undefined, { month: 'long', year: 'numeric', timeZone: 'UTC' });

export function Component() {
  const sales = useSales();
  const patterns = usePatternList();
  const refund = useRefund();
  const [confirming, setConfirming] = useState<ApiOrder | null>(null);
  const [showUnfinished, setShowUnfinished] = useState(false);
  const all = sales.data?.orders ?? [];
  const unfinished = all.filter((o) => !PAID_ONCE.includes(o.status)).length;
  const orders = showUnfinished ? all : all.filter((o) => PAID_ONCE.includes(o.status));
  const released = (patterns.data ?? []).filter((p) => p.myRole === 'owner' && p.status === 'released');

  return (
    <div className="flex min-h-0 flex-1 flex-col overflow-auto">
      <div className="mx-auto w-full max-w-6xl px-8 py-8">
        <div className="flex flex-wrap items-end justify-between gap-4">
          <div>
            <h1 className="text-title text-tide-900">Sales</h1>
            <p className="mt-1 text-sm text-tide-700">Orders of your patterns in the shop, totals per month, refunds.</p>
          </div>
          <a href="/api/sales/orders.csv" download className="btn btn-quiet">Download CSV</a>
        </div>

        <section className="mt-6" aria-labelledby="listings-heading">
          <h2 id="listings-heading" className="text-base font-semibold text-tide-900">Your released patterns</h2>
          {released.length === 0 ? (
            <p className="mt-1 text-sm text-tide-600">Release a pattern to put it on sale.</p>
          ) : (
            <ul className="mt-2 flex flex-wrap gap-2">
              {released.map((p) => (
                <li key={p.id}><Link to={`/patterns/${p.id}/listing`} className="btn btn-quiet btn-sm">{p.title}: shop listing</Link></li>
              ))}
            </ul>
          )}
        </section>

        {sales.isPending ? <Loading label="Loading your sales…" /> : sales.isError ? <Notice tone="error" className="mt-6">{errorText(sales.error)}</Notice> : (
          <>
            <section className="mt-8" aria-labelledby="totals-heading">
              <h2 id="totals-heading" className="text-base font-semibold text-tide-900">Totals per pattern and month</h2>
              <div className="card mt-2 overflow-x-auto">
                <table className="w-full text-sm">
                  <thead className="border-b border-tide-200 bg-tide-50 text-left text-caption uppercase tracking-wide text-tide-600">
                    <tr><th className="px-4 py-2">Month</th><th className="px-4 py-2">Pattern</th><th className="px-4 py-2 text-right">Orders</th><th className="px-4 py-2 text-right">Paid</th><th className="px-4 py-2 text-right">Refunded</th><th className="px-4 py-2 text-right">Net</th></tr>
                  </thead>
                  <tbody>
                    {sales.data.totals.length === 0 ? (
                      <tr><td colSpan={6} className="px-4 py-6 text-center text-tide-600">No paid orders yet.</td></tr>
                    ) : sales.data.totals.map((t) => (
                      <tr key={`${t.patternId}-${t.month}-${t.currency}`} className="border-b border-tide-100 last:border-0">
                        <td className="px-4 py-2">{monthName(t.month)}</td>
                        <td className="px-4 py-2 font-medium text-tide-900">{t.title}</td>
                        <td className="tabular px-4 py-2 text-right">{t.orders}</td>
                        <td className="tabular px-4 py-2 text-right">{formatMoney(t.gross, t.currency)}</td>
                        <td className="tabular px-4 py-2 text-right">{formatMoney(t.refunded, t.currency)}</td>
                        <td className="tabular px-4 py-2 text-right font-semibold">{formatMoney(t.net, t.currency)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </section>

            <section className="mt-8" aria-labelledby="orders-heading">
              <div className="flex items-end justify-between gap-4">
                <h2 id="orders-heading" className="text-base font-semibold text-tide-900">Orders</h2>
                <label className="flex items-center gap-2 text-sm text-tide-700">
                  <input type="checkbox" checked={showUnfinished} onChange={(e) => setShowUnfinished(e.target.checked)} />
                  Show unfinished checkouts ({unfinished})
                </label>
              </div>
              {refund.isError && <Notice tone="error" className="mt-2">{errorText(refund.error)}</Notice>}
              <div className="card mt-2 overflow-x-auto">
                <table className="w-full text-sm">
                  <thead className="border-b border-tide-200 bg-tide-50 text-left text-caption uppercase tracking-wide text-tide-600">
                    <tr><th className="px-4 py-2">Date</th><th className="px-4 py-2">Pattern</th><th className="px-4 py-2">Buyer</th><th className="px-4 py-2">Version</th><th className="px-4 py-2 text-right">Amount</th><th className="px-4 py-2">Status</th><th className="px-4 py-2"><span className="sr-only">Actions</span></th></tr>
                  </thead>
                  <tbody>
                    {orders.length === 0 ? (
                      <tr><td colSpan={7} className="px-4 py-6 text-center text-tide-600">No orders yet.</td></tr>
                    ) : orders.map((o) => (
                      <tr key={o.id} className="border-b border-tide-100 last:border-0">
                        <td className="px-4 py-2 whitespace-nowrap" title={fullTime(o.paidAt ?? o.createdAt)}>{new Date(o.paidAt ?? o.createdAt).toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' })}</td>
                        <td className="px-4 py-2 font-medium text-tide-900">{o.title}</td>
                        <td className="px-4 py-2">{o.buyer?.name}<span className="block text-caption text-tide-600">{o.buyer?.email}</span></td>
                        <td className="px-4 py-2">{o.version}</td>
                        <td className="tabular px-4 py-2 text-right">{formatMoney(o.price.amount, o.price.currency)}</td>
                        <td className="px-4 py-2"><OrderStatus status={o.status} /></td>
                        <td className="px-4 py-2 text-right">
                          {o.status === 'paid' && (confirming?.id === o.id ? (
                            <span className="inline-flex gap-1">
                              <button type="button" className="btn btn-danger btn-sm" disabled={refund.isPending} onClick={() => refund.mutate(o.id, { onSettled: () => setConfirming(null) })}>Confirm refund</button>
                              <button type="button" className="btn btn-quiet btn-sm" onClick={() => setConfirming(null)}>Keep</button>
                            </span>
                          ) : (
                            <button type="button" className="btn btn-quiet btn-sm" onClick={() => setConfirming(o)}>Refund…</button>
                          ))}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
              <p className="mt-2 text-caption text-tide-600">A refund returns the full amount through the payment provider and removes the pattern from the buyer’s library.</p>
            </section>
          </>
        )}
      </div>
    </div>
  );
}
