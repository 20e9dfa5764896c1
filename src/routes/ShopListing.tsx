/**
 * One listing: photos, the coarse chart preview, description, sizes,
 * version and price, and the Buy button, which sends a signed-in knitter to
 * the payment provider's page. Coming back from that page with
 * `?cancelled=<order>` closes the unpaid checkout (nothing is charged).
 */
import { useEffect, useRef } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import { errorText } from '../api/client';
import { useMe } from '../api/useAuth';
import { useCancelOrder, useCheckout, useListing } from '../api/useShop';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { Price, versionName } from '../components/shop/Price';

export function Component() {
  const { id = '' } = useParams();
  const [params] = useSearchParams();
  const cancelled = params.get('cancelled');
  const listing = useListing(id);
  const me = useMe();
  const checkout = useCheckout();
  const cancel = useCancelOrder();
  const cancelSent = useRef(false);

  useEffect(() => {
    if (cancelled && me.data && !cancelSent.current) {
      cancelSent.current = true;
      cancel.mutate(cancelled);
    }
  }, [cancelled, me.data, cancel]);

  if (listing.isPending) return <Loading label="Loading the pattern…" />;
  if (listing.isError) {
    return (
      <div className="mx-auto mt-16 max-w-md px-6">
        <Notice tone="error">{errorText(listing.error)}</Notice>
        <Link to="/shop" className="btn btn-quiet mt-3">Back to the shop</Link>
      </div>
    );
  }
  const l = listing.data;
  const buy = () => checkout.mutate(l.id, { onSuccess: (data) => window.location.assign(data.url) });

  return (
    <div className="flex min-h-0 flex-1 flex-col overflow-auto">
      <div className="mx-auto w-full max-w-5xl px-8 py-8">
        <Link to="/shop" className="text-sm font-medium text-lavender-700 hover:underline">← All patterns</Link>
        {cancelled && (
          <Notice tone="info" className="mt-4">You left the payment page. Nothing was charged; you can buy the pattern whenever you like.</Notice>
        )}
        <div className="mt-4 grid gap-8 md:grid-cols-[3fr_2fr]">
          <div className="flex flex-col gap-4">
            {l.photos.map((p) => (
              <img key={p.id} src={p.url} alt={`Photo of ${l.title}`} className="card w-full object-cover" />
            ))}
            <figure className="card p-4">
              <img src={l.previewUrl} alt={`Coarse colour preview of the ${l.title} chart`} className="mx-auto max-h-80 w-full object-contain [image-rendering:pixelated]" />
              <figcaption className="mt-2 text-caption text-tide-600">A coarse preview of the chart’s colours. The full chart and written instructions come with the pattern.</figcaption>
            </figure>
          </div>
          <div>
            <h1 className="text-title text-tide-900">{l.title}</h1>
            <p className="mt-1 text-sm text-tide-700">by {l.designer.name}</p>
            <p className="mt-4 whitespace-pre-line text-sm leading-relaxed text-tide-800">{l.description || 'No description yet.'}</p>
            <dl className="mt-4 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="text-tide-600">Sizes</dt><dd className="text-tide-900">{l.sizes.length ? l.sizes.join(', ') : '—'}</dd>
              <dt className="text-tide-600">Version</dt><dd className="text-tide-900">{versionName(l.version)}</dd>
            </dl>
            <div className="card mt-6 p-4">
              <Price price={l.price} className="text-lg" />
              <p className="mt-1 text-caption text-tide-600">One payment. Later releases of this pattern (errata) are yours at no charge.</p>
              {checkout.isError && <Notice tone="error" className="mt-3">{errorText(checkout.error)}</Notice>}
              {l.isMine ? (
                <Link to={`/patterns/${l.patternId}/listing`} className="btn btn-quiet mt-4 w-full">Edit your listing</Link>
              ) : l.owned ? (
                <Link to={`/patterns/${l.patternId}`} className="btn btn-primary mt-4 w-full">Open from your library</Link>
              ) : me.data ? (
                <button type="button" className="btn btn-primary mt-4 w-full" onClick={buy} disabled={checkout.isPending || checkout.isSuccess}>
                  {checkout.isPending || checkout.isSuccess ? 'Opening the payment page…' : 'Buy this pattern'}
                </button>
              ) : (
                <Link to={`/sign-in?next=${encodeURIComponent(`/shop/${l.id}`)}`} className="btn btn-primary mt-4 w-full">Sign in to buy</Link>
              )}
            </div>
          </div>
        </div>
      </div>
    </div>
  );
}
