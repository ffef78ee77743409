/**
 * The payment provider's published test card numbers the checkout page accepts
 * (Stripe docs, "Testing": 4242 4242 4242 4242 succeeds; 4000 0000 0000 0002 is a generic decline).
 * Anything else is refused: this page never takes a real card.
 */
export type CardOutcome = { ok: true; brand: string; last4: string } | { ok: false; code: 'card_declined' | 'not_a_test_card'; message: string };

const TEST_CARDS: Record<string, { brand: string; declined: boolean }> = {
  '4242424242424242': { brand: 'visa', declined: false },
  '4000000000000002': { brand: 'visa', declined: true },
};

export function tryCard(rawNumber: string): CardOutcome {
  const digits = rawNumber.replace(/[\s-]/g, '');
  const card = TEST_CARDS[digits];
  if (!card) {
    return {
      ok: false,
      code: 'not_a_test_card',
      message: 'This test page accepts only the listed test card numbers. Never enter a real card here.',
    };
  }
  if (card.declined) return { ok: false, code: 'card_declined', message: 'Your card was declined. No payment was taken; try another card.' };
  return { ok: true, brand: card.brand, last4: digits.slice(-4) };
}
