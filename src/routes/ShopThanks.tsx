/**
 * Where the payment page sends the buyer back: waits for the provider's
 * confirmation (the order turns paid when the signed webhook lands), then
 * points to the pattern in the library.
 */
import { Link, useSearchParams } from 'react-router';
import { errorText } from '../api/client';
import { useOrder } from '../api/useShop';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { Price } from '../components/shop/Price';

export function Component() {
  const [params] = useSearchParams();
  const orderId = params.get('order') ?? '';
  const order = useOrder(orderId);

  return (
    <div className="flex min-h-0 flex-1 flex-col overflow-auto">
      <div className="mx-auto w-full max-w-xl px-8 py-12">
        {order.isPending ? (
          <Loading label="Checking your payment…" />
        ) : order.isError ? (
          <Notice tone="error">{errorText(order.error)}</Notice>
        ) : order.data.status === 'paid' ? (
          <div className="card p-6">
            <h1 className="text-title text-tide-900">Thank you</h1>
            <p className="mt-2 text-sm text-tide-800">
              “{order.data.title}” is in your library now ({order.data.version}). A receipt is on its way to your e-mail.
            </p>
            <p className="mt-2 text-sm text-tide-700">Paid <Price price={order.data.price} /></p>
            <div className="mt-5 flex gap-2">
              <Link to={`/patterns/${order.data.patternId}`} className="btn btn-primary">Open the pattern</Link>
              <Link to="/patterns" className="btn btn-quiet">Your patterns</Link>
            </div>
          </div>
        ) : order.data.status === 'pending' ? (
          <div className="card p-6">
            <Loading label="Waiting for the payment provider to confirm…" />
            <p className="text-center text-caption text-tide-600">This usually takes a few seconds. You can leave this page; the receipt will come by e-mail.</p>
          </div>
        ) : (
          <Notice tone="warning">
            This order is {order.data.status.replace('-', ' ')}; nothing was added to your library. <Link to="/shop" className="font-medium underline">Back to the shop</Link>
          </Notice>
        )}
      </div>
    </div>
  );
}
