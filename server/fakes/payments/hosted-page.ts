import type { FakeCheckoutSession } from './state';
import { TEST_CARDS } from './state';

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

const money = (amount: number, currency: string) => `${currency.toLowerCase() === 'eur' ? '€' : `${currency.toUpperCase()} `}${(amount / 100).toFixed(2)}`;

const STYLE = `
  :root { color-scheme: light; }
  body { margin: 0; font-family: system-ui, -apple-system, "Segoe UI", sans-serif; background: #eef2f0; color: #17201c; }
  .band { background: #7a4b00; color: #fff; padding: 10px 16px; font-size: 14px; text-align: center; }
  main { max-width: 420px; margin: 24px auto; padding: 0 16px; }
  .card { background: #fff; border-radius: 12px; padding: 20px; box-shadow: 0 1px 3px rgba(0,0,0,.12); }
  h1 { font-size: 20px; margin: 0 0 4px; }
  .amount { font-size: 32px; font-weight: 700; margin: 12px 0; }
  label { display: block; font-size: 14px; margin: 16px 0 6px; }
  input { width: 100%; box-sizing: border-box; font-size: 18px; padding: 10px; border: 1px solid #9aa7a0; border-radius: 8px; min-height: 44px; }
  button { width: 100%; min-height: 48px; font-size: 17px; border-radius: 8px; border: 0; margin-top: 12px; cursor: pointer; }
  .pay { background: #1f6f50; color: #fff; }
  .decline { background: #fff; color: #8a1c1c; border: 1px solid #8a1c1c; }
  .hint { font-size: 13px; color: #4d5b54; margin-top: 16px; line-height: 1.4; }
  .done { font-size: 16px; }
`;

/** The fake's hosted payment page: our own look, clearly marked as a local test page. */
export function hostedPageHtml(session: FakeCheckoutSession): string {
  const head = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Test payment — Spinyard local fake</title><style>${STYLE}</style></head><body>`;
  const band = `<div class="band" role="note">Local test payment page — no real card is charged and no money moves.</div>`;
  if (session.status !== 'open') {
    const back = session.status === 'complete' ? session.success_url : session.cancel_url;
    return `${head}${band}<main><div class="card"><h1>${escape(session.description)}</h1><p class="done">This payment is ${session.status === 'complete' ? 'already paid' : 'closed'}.</p><a href="${escape(back)}">Back to Spinyard</a></div></main></body></html>`;
  }
  return `${head}${band}<main><div class="card">
  <h1>${escape(session.description)}</h1>
  <div>Quantity ${session.quantity}</div>
  <div class="amount" data-testid="fake-amount">${money(session.amount_total, session.currency)}</div>
  <form method="post" action="/pay/${encodeURIComponent(session.id)}">
    <label for="card">Test card number</label>
    <input id="card" name="card" inputmode="numeric" autocomplete="off" value="${TEST_CARDS.pays}" aria-label="Test card number">
    <button class="pay" type="submit" name="action" value="pay" aria-label="Pay ${money(session.amount_total, session.currency)}">Pay ${money(session.amount_total, session.currency)}</button>
    <button class="decline" type="submit" name="action" value="decline" aria-label="Decline this payment">Decline (simulate a refused card)</button>
  </form>
  <p class="hint">Test cards: ${TEST_CARDS.pays} pays; ${TEST_CARDS.declined} is declined; ${TEST_CARDS.insufficientFunds} has insufficient funds.</p>
  <p class="hint"><a href="${escape(session.cancel_url)}">Cancel and go back</a></p>
</div></main></body></html>`;
}
