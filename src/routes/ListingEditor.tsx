/**
 * The owner's listing of a released pattern: price (typed as a decimal,
 * kept and sent as integer minor units), currency, tax-inclusive or not, a
 * short description, photos from the pattern's uploads, and whether it is
 * on sale now.
 */
import { useEffect, useRef, useState, type FormEvent } from 'react';
import { Link, useParams } from 'react-router';
import { CURRENCIES, decimalToMinor, formatMoney, minorToDecimal, MIN_AMOUNT, type CurrencyCode } from '../../shared/shop/money';
import { LISTING_MAX_PHOTOS } from '../../shared/shop/api';
import { errorText } from '../api/client';
import { useListingEditor, useSaveListing, useUploadListingPhoto } from '../api/useShop';
import { Loading } from '../components/Loading';
import { Notice } from '../components/Notice';
import { versionName } from '../components/shop/Price';

export function Component() {
  const { id = '' } = useParams();
  const editor = useListingEditor(id);
  const save = useSaveListing(id);
  const upload = useUploadListingPhoto(id);
  const fileInput = useRef<HTMLInputElement>(null);
  const [currency, setCurrency] = useState<CurrencyCode>('EUR');
  const [priceText, setPriceText] = useState('6.50');
  const [taxInclusive, setTaxInclusive] = useState(true);
  const [description, setDescription] = useState('');
  const [photoIds, setPhotoIds] = useState<number[]>([]);
  const [active, setActive] = useState(true);
  const [loadedFor, setLoadedFor] = useState<number | null>(null);

  // Fill the form once from the saved listing.
  const listing = editor.data?.listing ?? null;
  useEffect(() => {
    if (!listing || loadedFor === listing.id) return;
    setLoadedFor(listing.id);
    setCurrency(listing.price.currency);
    setPriceText(minorToDecimal(listing.price.amount, listing.price.currency));
    setTaxInclusive(listing.price.taxInclusive);
    setDescription(listing.description);
    setPhotoIds(listing.photos.map((p) => p.id));
    setActive(listing.active);
  }, [listing, loadedFor]);

  if (editor.isPending) return <Loading label="Loading the listing…" />;
  if (editor.isError) return <div className="mx-auto mt-16 max-w-md px-6"><Notice tone="error">{errorText(editor.error)}</Notice></div>;
  const { released, uploads } = editor.data;

  const amount = decimalToMinor(priceText, currency);
  const priceError = amount === null ? `Enter a price such as ${currency === 'JPY' ? '800' : '6.50'}.` : amount < MIN_AMOUNT ? `The price must be at least ${formatMoney(MIN_AMOUNT, currency)}.` : null;
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (priceError || amount === null) return;
    save.mutate({ currency, amount, taxInclusive, description, photoIds, active });
  };
  const togglePhoto = (uploadId: number) =>
    setPhotoIds((ids) => (ids.includes(uploadId) ? ids.filter((x) => x !== uploadId) : ids.length < LISTING_MAX_PHOTOS ? [...ids, uploadId] : ids));

  return (
    <div className="flex min-h-0 flex-1 flex-col overflow-auto">
      <div className="mx-auto w-full max-w-3xl px-8 py-8">
        <Link to="/sales" className="text-sm font-medium text-lavender-700 hover:underline">← Sales</Link>
        <h1 className="mt-2 text-title text-tide-900">Shop listing</h1>
        {!released ? (
          <Notice tone="warning" className="mt-4">
            Release a version of this pattern first; buyers get the released version and every later release.{' '}
            <Link to={`/patterns/${id}`} className="font-medium underline">Open the pattern</Link>
          </Notice>
        ) : (
          <form className="card mt-4 flex flex-col gap-5 p-6" onSubmit={submit} noValidate>
            <p className="text-sm text-tide-700">Selling {versionName(released)}. Buyers also receive later releases (errata) at no charge.</p>
            <div className="flex flex-wrap gap-4">
              <div className="w-40">
                <label htmlFor="listing-price" className="field-label">Price</label>
                <input id="listing-price" className="field-input tabular" inputMode="decimal" value={priceText} aria-invalid={priceError ? 'true' : undefined}
                  aria-describedby="listing-price-help" onChange={(e) => setPriceText(e.target.value)} />
              </div>
              <div className="w-32">
                <label htmlFor="listing-currency" className="field-label">Currency</label>
                <select id="listing-currency" className="field-input" value={currency} onChange={(e) => setCurrency(e.target.value as CurrencyCode)}>
                  {CURRENCIES.map((c) => <option key={c} value={c}>{c}</option>)}
                </select>
              </div>
              <label className="mt-6 flex items-center gap-2 text-sm text-tide-800">
                <input type="checkbox" checked={taxInclusive} onChange={(e) => setTaxInclusive(e.target.checked)} />
                Tax (VAT) included
              </label>
            </div>
            <p id="listing-price-help" className={`-mt-3 text-caption ${priceError ? 'text-glasswort-700' : 'text-tide-600'}`}>
              {priceError ?? `Buyers pay ${formatMoney(amount!, currency)}${taxInclusive ? ', tax included' : ' plus any tax due'}.`}
            </p>
            <div>
              <label htmlFor="listing-description" className="field-label">Short description</label>
              <textarea id="listing-description" className="field-input min-h-28" maxLength={1000} value={description} onChange={(e) => setDescription(e.target.value)}
                placeholder="What it is, yarn weight, techniques, finished size." />
              <p className="mt-1 text-caption text-tide-600">{description.length} / 1000</p>
            </div>
            <fieldset>
              <legend className="field-label">Photos (up to {LISTING_MAX_PHOTOS}, from this pattern’s uploads)</legend>
              <input ref={fileInput} type="file" accept="image/png,image/jpeg,image/webp" className="hidden" aria-hidden="true" tabIndex={-1}
                onChange={(e) => {
                  const file = e.target.files?.[0];
                  e.target.value = '';
                  if (file) upload.mutate(file, { onSuccess: (d) => setPhotoIds((ids) => (ids.length < LISTING_MAX_PHOTOS ? [...ids, d.upload.id] : ids)) });
                }} />
              <button type="button" className="btn btn-quiet btn-sm mb-2" onClick={() => fileInput.current?.click()} disabled={upload.isPending}>
                {upload.isPending ? 'Uploading…' : 'Upload a photo'}
              </button>
              {upload.isError && <Notice tone="error" className="mb-2">{errorText(upload.error)}</Notice>}
              {uploads.length === 0 ? (
                <p className="text-sm text-tide-600">No photos uploaded for this pattern yet. Without photos the shop shows a coarse preview of the chart.</p>
              ) : (
                <ul className="mt-1 grid grid-cols-3 gap-3 sm:grid-cols-4">
                  {uploads.map((u) => (
                    <li key={u.id}>
                      <label className={`block cursor-pointer overflow-hidden rounded-stitch border-2 ${photoIds.includes(u.id) ? 'border-lavender-600' : 'border-transparent'}`}>
                        <img src={u.url} alt={u.originalName} className="aspect-square w-full object-cover" />
                        <span className="flex items-center gap-1 p-1 text-caption text-tide-700">
                          <input type="checkbox" checked={photoIds.includes(u.id)} onChange={() => togglePhoto(u.id)} /> {u.originalName}
                        </span>
                      </label>
                    </li>
                  ))}
                </ul>
              )}
            </fieldset>
            <label className="flex items-center gap-2 text-sm font-medium text-tide-900">
              <input type="checkbox" checked={active} onChange={(e) => setActive(e.target.checked)} />
              On sale in the shop
            </label>
            {save.isError && <Notice tone="error">{errorText(save.error)}</Notice>}
            {save.isSuccess && !save.isPending && <Notice tone="success">Saved. {active ? 'The pattern is on sale.' : 'The listing is hidden from the shop.'}</Notice>}
            <div className="flex gap-2">
              <button type="submit" className="btn btn-primary" disabled={save.isPending || priceError !== null}>{save.isPending ? 'Saving…' : 'Save listing'}</button>
              {listing && <Link to={`/shop/${listing.id}`} className="btn btn-quiet">View in the shop</Link>}
            </div>
          </form>
        )}
      </div>
    </div>
  );
}
