/**
 * The public shop: every released pattern on sale, for anyone to browse
 * (no sign-in needed). Pictures are the designer's photos or a coarse
 * colour preview of the chart, never the pattern itself.
 */
import { useMemo, useState } from 'react';
import { errorText } from '../api/client';
import { useShop } from '../api/useShop';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { ListingCard } from '../components/shop/ListingCard';

export function Component() {
  const shop = useShop();
  const [query, setQuery] = useState('');
  const listings = useMemo(() => {
    const q = query.trim().toLowerCase();
    const all = shop.data?.listings ?? [];
    return q ? all.filter((l) => l.title.toLowerCase().includes(q) || l.designer.name.toLowerCase().includes(q)) : all;
  }, [shop.data, query]);

  return (
    <div className="flex min-h-0 flex-1 flex-col overflow-auto">
      <div className="mx-auto w-full max-w-6xl px-8 py-8">
        <div className="flex flex-wrap items-end justify-between gap-4">
          <div>
            <h1 className="text-title text-tide-900">Shop</h1>
            <p className="mt-1 text-sm text-tide-700">Released patterns from independent designers. Later errata releases reach buyers at no charge.</p>
          </div>
          <div className="w-72">
            <label htmlFor="shop-search" className="field-label">Search the shop</label>
            <input id="shop-search" type="search" className="field-input" placeholder="Title or designer" value={query} onChange={(e) => setQuery(e.target.value)} />
          </div>
        </div>
        {shop.data && !shop.data.payments && (
          <Notice tone="warning" className="mt-4">Payments are not set up on this server, so patterns can be browsed but not bought.</Notice>
        )}
        <div className="mt-6">
          {shop.isPending ? (
            <Loading label="Loading the shop…" />
          ) : shop.isError ? (
            <Notice tone="error">{errorText(shop.error)}</Notice>
          ) : listings.length === 0 ? (
            <div className="card px-8 py-14 text-center">
              <h2 className="text-base font-semibold text-tide-900">{query.trim() ? 'Nothing matches that search' : 'Nothing on sale yet'}</h2>
              <p className="mx-auto mt-1 max-w-md text-sm text-tide-700">
                {query.trim() ? 'Try another title or designer name.' : 'Designers put a pattern on sale once a version of it is released.'}
              </p>
            </div>
          ) : (
            <ul className="grid grid-cols-1 gap-5 sm:grid-cols-2 lg:grid-cols-3" aria-label="Patterns on sale">
              {listings.map((l) => <ListingCard key={l.id} listing={l} />)}
            </ul>
          )}
        </div>
      </div>
    </div>
  );
}
