/**
 * A listing in the shop grid: a photo (or the coarse chart preview), title,
 * designer, sizes, price and where the person stands (bought, their own).
 */
import { Link } from 'react-router';
import type { ApiListing } from '../../../shared/shop/api';
import { Price, versionName } from './Price';

export function ListingCard({ listing }: { listing: ApiListing }) {
  const picture = listing.photos[0]?.url ?? listing.previewUrl;
  return (
    <li className="card flex flex-col overflow-hidden">
      <Link to={`/shop/${listing.id}`} className="group flex flex-1 flex-col focus-visible:outline-offset-[-2px]">
        <div className="flex aspect-[4/3] items-center justify-center overflow-hidden border-b border-tide-200 bg-foam">
          <img src={picture} alt={listing.photos[0] ? `Photo of ${listing.title}` : `Coarse colour preview of the ${listing.title} chart`}
            className={listing.photos[0] ? 'h-full w-full object-cover' : 'h-full w-full object-contain p-4 [image-rendering:pixelated]'} loading="lazy" />
        </div>
        <div className="flex flex-1 flex-col gap-1 p-4">
          <h2 className="text-base font-semibold text-tide-900 group-hover:text-lavender-700">{listing.title}</h2>
          <p className="text-sm text-tide-700">by {listing.designer.name}</p>
          <p className="text-caption text-tide-600">
            {listing.sizes.length ? `Sizes ${listing.sizes.join(', ')} · ` : ''}{versionName(listing.version)}
          </p>
          <div className="mt-auto flex items-center justify-between pt-3">
            <Price price={listing.price} />
            {listing.isMine ? (
              <span className="text-caption font-medium text-tide-600">Your listing</span>
            ) : listing.owned ? (
              <span className="rounded-full bg-samphire-50 px-2 py-0.5 text-caption font-medium text-samphire-800">In your library</span>
            ) : null}
          </div>
        </div>
      </Link>
    </li>
  );
}
