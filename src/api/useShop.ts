/**
 * Shop hooks: the public shop and one listing, checkout (which answers with
 * the payment page to go to), the buyer's order after paying, the owner's
 * listing editor, and the designer's sales with refunds. Money stays an
 * integer of minor units from the server to the screen.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiCheckout, ApiListing, ApiListingEditor, ApiOrder, ApiSalesTotal, ListingBody } from '../../shared/shop/api';
import { apiRequest } from './client';
import { queryKeys } from './keys';

/** Query keys of the shop (kept beside the hooks; every one starts with 'shop' or 'sales'). */
export const shopKeys = {
  shop: ['shop'] as const,
  listing: (id: string) => ['shop', 'listing', id] as const,
  order: (id: string) => ['shop', 'order', id] as const,
  editor: (patternId: string) => ['shop', 'editor', patternId] as const,
  sales: ['sales'] as const,
};

/** Everything on sale (no sign-in needed). `payments` is false when the server cannot take payments. */
export function useShop() {
  return useQuery({
    queryKey: shopKeys.shop,
    queryFn: ({ signal }) => apiRequest<{ listings: ApiListing[]; payments: boolean }>('/shop', { signal }),
  });
}

/** One listing (public while on sale). */
export function useListing(id: string) {
  return useQuery({
    queryKey: shopKeys.listing(id),
    queryFn: async ({ signal }) => (await apiRequest<{ listing: ApiListing }>(`/shop/listings/${encodeURIComponent(id)}`, { signal })).listing,
  });
}

/** Starts a checkout; the caller sends the browser to `url` (the provider's payment page). */
export function useCheckout() {
  return useMutation({
    mutationFn: (listingId: number) => apiRequest<ApiCheckout>(`/shop/listings/${listingId}/checkout`, { body: {} }),
  });
}

/** The buyer's order, re-read every second while it is pending (the payment webhook may still be on its way). */
export function useOrder(id: string) {
  const qc = useQueryClient();
  return useQuery({
    queryKey: shopKeys.order(id),
    queryFn: async ({ signal }) => {
      const order = (await apiRequest<{ order: ApiOrder }>(`/shop/orders/${encodeURIComponent(id)}`, { signal })).order;
      if (order.status === 'paid') {
        void qc.invalidateQueries({ queryKey: queryKeys.patterns });
        void qc.invalidateQueries({ queryKey: shopKeys.shop });
      }
      return order;
    },
    refetchInterval: (query) => (query.state.data?.status === 'pending' && query.state.dataUpdateCount < 60 ? 1000 : false),
  });
}

/** Tells the server the buyer left the payment page (the session is expired; nothing is charged). */
export function useCancelOrder() {
  return useMutation({
    mutationFn: (orderId: string) => apiRequest<{ order: ApiOrder }>(`/shop/orders/${encodeURIComponent(orderId)}/cancel`, { body: {} }),
  });
}

/** The owner's listing editor data for a pattern. */
export function useListingEditor(patternId: string) {
  return useQuery({
    queryKey: shopKeys.editor(patternId),
    queryFn: ({ signal }) => apiRequest<ApiListingEditor>(`/patterns/${encodeURIComponent(patternId)}/listing`, { signal }),
  });
}

/** Saves the listing (price in minor units, description, photos, on sale or not). */
export function useSaveListing(patternId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ListingBody) => apiRequest<{ listing: ApiListing }>(`/patterns/${encodeURIComponent(patternId)}/listing`, { method: 'PUT', body }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: shopKeys.editor(patternId) });
      void qc.invalidateQueries({ queryKey: shopKeys.shop });
    },
  });
}

/** The designer's orders and totals. */
export function useSales() {
  return useQuery({
    queryKey: shopKeys.sales,
    queryFn: ({ signal }) => apiRequest<{ orders: ApiOrder[]; totals: ApiSalesTotal[] }>('/sales', { signal }),
  });
}

/** Refunds a paid order (the provider confirms; access is revoked then). */
export function useRefund() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (orderId: number) => apiRequest<{ order: ApiOrder }>(`/sales/orders/${orderId}/refund`, { body: {} }),
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: shopKeys.sales });
      // The provider's webhook follows the refund closely; read again once it has landed.
      setTimeout(() => void qc.invalidateQueries({ queryKey: shopKeys.sales }), 1500);
    },
  });
}

/** Uploads a photo (PNG, JPEG or WebP, at most 5 MB) to the pattern, for use in its listing. */
export function useUploadListingPhoto(patternId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => {
      const form = new FormData();
      form.append('file', file);
      return apiRequest<{ upload: { id: number } }>(`/patterns/${encodeURIComponent(patternId)}/uploads`, { body: form });
    },
    onSuccess: () => void qc.invalidateQueries({ queryKey: shopKeys.editor(patternId) }),
  });
}
