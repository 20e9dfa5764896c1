/**
 * Request schemas and response types of the shop API (listings, checkout,
 * orders, sales), shared by the server and the studio. Money is an integer
 * amount in the currency's minor unit everywhere (see money.ts).
 */
import { z } from 'zod';
import { CURRENCIES, MAX_AMOUNT, MIN_AMOUNT, type CurrencyCode } from './money';

/** Most photos one listing shows. */
export const LISTING_MAX_PHOTOS = 6;

/** The owner's listing of a released pattern: price, description, photos, on sale or not. */
export const listingBody = z.object({
  currency: z.enum(CURRENCIES as [CurrencyCode, ...CurrencyCode[]]),
  amount: z.number({ message: 'Enter the price as a whole number of minor units (e.g. 650 for 6.50).' })
    .int({ message: 'The price must be a whole number of minor units (cents, pence), never a fraction.' })
    .min(MIN_AMOUNT, { message: `The price must be at least ${MIN_AMOUNT} minor units.` })
    .max(MAX_AMOUNT, { message: `The price must be at most ${MAX_AMOUNT} minor units.` }),
  taxInclusive: z.boolean(),
  description: z.string().trim().max(1000, { message: 'Keep the description to 1000 characters.' }),
  photoIds: z.array(z.number().int().positive()).max(LISTING_MAX_PHOTOS, { message: `Choose at most ${LISTING_MAX_PHOTOS} photos.` }).default([]),
  active: z.boolean(),
});
export type ListingBody = z.input<typeof listingBody>;

/** A price as shown and charged. */
export interface ApiPrice { currency: CurrencyCode; amount: number; taxInclusive: boolean }

/** The version a listing sells now: the released revision and its label, if it has one. */
export interface ApiVersion { revision: number; label: string | null }

/** A listing as the shop shows it. */
export interface ApiListing {
  id: number;
  patternId: number;
  title: string;
  designer: { id: number; name: string };
  description: string;
  price: ApiPrice;
  active: boolean;
  version: ApiVersion;
  sizes: string[];
  photos: { id: number; url: string }[];
  /** Coarse chart preview (SVG of colour blocks, no text or instructions). */
  previewUrl: string;
  /** The signed-in caller already has the pattern (bought it or works on it). */
  owned: boolean;
  /** The signed-in caller is the designer selling it. */
  isMine: boolean;
  updatedAt: string;
}

/** What the listing editor needs: the listing (null before the first save) and the photos to choose from. */
export interface ApiListingEditor {
  listing: ApiListing | null;
  released: ApiVersion | null;
  uploads: { id: number; url: string; originalName: string }[];
}

export const ORDER_STATUS_NAMES = ['pending', 'paid', 'failed', 'expired', 'cancelled', 'refund-pending', 'refunded'] as const;
export type OrderStatusName = (typeof ORDER_STATUS_NAMES)[number];

/** An order as its buyer or the designer sees it. */
export interface ApiOrder {
  id: number;
  listingId: number;
  patternId: number;
  title: string;
  status: OrderStatusName;
  price: ApiPrice;
  /** "1.0" when the release had a label, else "revision 3". */
  version: string;
  buyer: { id: number; name: string; email: string } | null;
  createdAt: string;
  paidAt: string | null;
  refundedAt: string | null;
}

/** Sales of one pattern in one month and currency (amounts in minor units; net = gross - refunded). */
export interface ApiSalesTotal {
  patternId: number; title: string; month: string; currency: CurrencyCode;
  orders: number; gross: number; refunded: number; net: number;
}

/** The answer of POST /api/shop/listings/:id/checkout: go to `url` (the provider's payment page). */
export interface ApiCheckout { order: ApiOrder; url: string }
