/** "€24.00" from minor units (cents). */
export function formatMoney(minor: number, currency: string): string {
  return new Intl.NumberFormat('en-IE', { style: 'currency', currency: currency.toUpperCase() }).format(minor / 100);
}

/** "5,000" with a thin grouping, for limits. */
export const formatCount = (n: number) => new Intl.NumberFormat('en-GB').format(n);
