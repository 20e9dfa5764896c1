/**
 * Money helpers: integer minor units only. The decimal places per currency
 * are checked against the runtime's Intl.NumberFormat (which follows ISO
 * 4217's minor units as published in CLDR: two for the euro and pound, none
 * for the yen).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CURRENCIES, CURRENCY_DECIMALS, decimalToMinor, formatMoney, minorToDecimal } from '../../shared/shop/money.ts';

describe('money in minor units', () => {
  it.each(CURRENCIES)('%s has the minor unit Intl reports', (c) => {
    expect(CURRENCY_DECIMALS[c]).toBe(new Intl.NumberFormat('en', { style: 'currency', currency: c }).resolvedOptions().maximumFractionDigits);
  });

  it('writes decimals by string arithmetic', () => {
    expect(minorToDecimal(650, 'EUR')).toBe('6.50');
    expect(minorToDecimal(5, 'GBP')).toBe('0.05');
    expect(minorToDecimal(800, 'JPY')).toBe('800');
    expect(minorToDecimal(-5, 'USD')).toBe('-0.05');
    expect(() => minorToDecimal(6.5, 'EUR')).toThrow(/integer/);
  });

  it('parses what people type without floating point (0.1 + 0.2 style errors cannot happen)', () => {
    expect(decimalToMinor('6.5', 'EUR')).toBe(650);
    expect(decimalToMinor('0,30', 'EUR')).toBe(30);
    expect(decimalToMinor('19.99', 'USD')).toBe(1999);
    expect(decimalToMinor('1.005', 'EUR')).toBeNull();
    expect(decimalToMinor('800', 'JPY')).toBe(800);
    expect(decimalToMinor('800.5', 'JPY')).toBeNull();
    expect(decimalToMinor('-1', 'EUR')).toBeNull();
    expect(decimalToMinor('abc', 'EUR')).toBeNull();
  });

  it('round-trips every amount (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 99_999_999 }), fc.constantFrom(...CURRENCIES), (amount, currency) =>
      decimalToMinor(minorToDecimal(amount, currency), currency) === amount));
  });

  it('formats with the currency sign through Intl', () => {
    expect(formatMoney(650, 'EUR')).toBe('€6.50');
    expect(formatMoney(1200, 'JPY')).toBe('JP¥1,200');
    expect(formatMoney(123456789, 'GBP')).toBe('£1,234,567.89');
  });
});
