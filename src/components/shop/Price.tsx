/** A price from integer minor units, with its tax note. */
import { formatMoney } from '../../../shared/shop/money';
import type { ApiPrice } from '../../../shared/shop/api';

export function Price({ price, showTax = true, className = '' }: { price: ApiPrice; showTax?: boolean; className?: string }) {
  return (
    <span className={className}>
      <span className="tabular font-semibold text-tide-900">{formatMoney(price.amount, price.currency)}</span>
      {showTax && <span className="ml-1 text-caption text-tide-600">{price.taxInclusive ? 'incl. tax' : 'plus tax where due'}</span>}
    </span>
  );
}

/** "1.1" or "revision 3". */
export function versionName(v: { revision: number; label: string | null }): string {
  return v.label ? `version ${v.label}` : `revision ${v.revision}`;
}
