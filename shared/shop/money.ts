/**
 * Money in the shop: always an integer amount in the currency's minor unit
 * (cents, pence, öre; yen have none), never a float. Shared by the server
 * (validation, receipts, CSV) and the studio (price fields, labels).
 */

/**
 * Currencies a listing may use, with the number of decimal places of each
 * (ISO 4217 minor unit exponent: 2 for most, 0 for the yen). The tests
 * compare these with what the runtime's Intl.NumberFormat reports.
 */
export const CURRENCY_DECIMALS = {
  EUR: 2, GBP: 2, USD: 2, CAD: 2, AUD: 2, NZD: 2, CHF: 2, SEK: 2, NOK: 2, DKK: 2, JPY: 0,
} as const;

/** An accepted ISO 4217 code, upper case. */
export type CurrencyCode = keyof typeof CURRENCY_DECIMALS;
export const CURRENCIES = Object.keys(CURRENCY_DECIMALS) as CurrencyCode[];

/** Smallest price accepted, in minor units (card providers refuse tiny charges; 0.50 in two-decimal currencies, 50 yen). */
export const MIN_AMOUNT = 50;
/** Largest price accepted, in minor units (well inside a 32-bit unsigned column). */
export const MAX_AMOUNT = 99_999_999;

/** True when `code` is one of {@link CURRENCIES}. */
export function isCurrency(code: string): code is CurrencyCode {
  return Object.prototype.hasOwnProperty.call(CURRENCY_DECIMALS, code);
}

/**
 * The decimal form of an integer minor-unit amount, by string arithmetic:
 * (1250, 'EUR') -> "12.50", (800, 'JPY') -> "800", (-5, 'GBP') -> "-0.05".
 * Throws on a non-integer amount (a programmer error: money is never a float).
 */
export function minorToDecimal(amount: number, currency: CurrencyCode): string {
  if (!Number.isSafeInteger(amount)) throw new Error(`money must be an integer number of minor units, got ${amount}`);
  const decimals = CURRENCY_DECIMALS[currency];
  const sign = amount < 0 ? '-' : '';
  const digits = String(Math.abs(amount)).padStart(decimals + 1, '0');
  if (decimals === 0) return sign + digits;
  return `${sign}${digits.slice(0, -decimals)}.${digits.slice(-decimals)}`;
}

/**
 * Parses what a person typed ("12.5", "12,50", "800") into integer minor
 * units, or null when it is not a plain non-negative amount with at most the
 * currency's number of decimals. No floating point is involved.
 */
export function decimalToMinor(text: string, currency: CurrencyCode): number | null {
  const decimals = CURRENCY_DECIMALS[currency];
  const m = /^\s*(\d{1,9})(?:[.,](\d*))?\s*$/.exec(text);
  if (!m) return null;
  const fraction = m[2] ?? '';
  if (fraction.length > decimals) return null;
  const value = Number(m[1] + fraction.padEnd(decimals, '0'));
  return Number.isSafeInteger(value) ? value : null;
}

/** A price for people to read, e.g. "€12.50" or "¥800", formatted by Intl from the exact decimal string. */
export function formatMoney(amount: number, currency: CurrencyCode, locale = 'en-GB'): string {
  const decimal = minorToDecimal(amount, currency);
  // Intl accepts a decimal string exactly (no binary rounding) in current runtimes.
  const format = new Intl.NumberFormat(locale, { style: 'currency', currency, minimumFractionDigits: CURRENCY_DECIMALS[currency] });
  return format.format(decimal as unknown as number);
}
