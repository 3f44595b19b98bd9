// Amounts in the payments API are integers in the currency's smallest unit (cents for usd).

// Currencies the hosted service treats as zero-decimal (from memory of its currency docs).
const ZERO_DECIMAL_CURRENCIES = new Set([
  'bif', 'clp', 'djf', 'gnf', 'jpy', 'kmf', 'krw', 'mga', 'pyg', 'rwf', 'ugx', 'vnd', 'vuv', 'xaf', 'xof', 'xpf',
]);

/** Formats an amount in the smallest currency unit for people, e.g. (12345, 'usd') → "$123.45". */
export function formatAmount(amountMinor: number, currency: string): string {
  const digits = ZERO_DECIMAL_CURRENCIES.has(currency.toLowerCase()) ? 0 : 2;
  try {
    return new Intl.NumberFormat('en-US', {
      style: 'currency',
      currency: currency.toUpperCase(),
      minimumFractionDigits: digits,
      maximumFractionDigits: digits,
    }).format(amountMinor / 10 ** digits);
  } catch {
    return `${(amountMinor / 10 ** digits).toFixed(digits)} ${currency.toUpperCase()}`;
  }
}
