// The fake's hosted test payment page: plain server-rendered HTML with inline styles and no
// external assets or scripts. It says plainly that it is a test page of the local fake.

import { formatAmount } from './money';
import type { FakeCheckoutSession, FakeLineItem } from './ledger';

export interface PayPageView {
  session: FakeCheckoutSession;
  lineItems: FakeLineItem[];
  /** A message shown above the form (a decline or an unknown card), or null. */
  errorMessage?: string | null;
  /** The number the person typed, kept after a failed attempt. */
  cardValue?: string;
}

/** Escapes text for HTML element content and double-quoted attribute values. */
export function escapeHtml(text: string): string {
  return text
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

const STYLE = `
*{box-sizing:border-box}
body{margin:0;font:16px/1.5 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;background:#f4f1ea;color:#1f2a24}
.banner{background:#7a3e00;color:#fff;padding:.6rem 1rem;text-align:center;font-weight:600;letter-spacing:.02em}
main{max-width:28rem;margin:2rem auto;padding:0 1rem}
.card{background:#fff;border:1px solid #d8d2c4;border-radius:10px;padding:1.5rem;box-shadow:0 1px 3px rgba(0,0,0,.06)}
h1{font-size:1.25rem;margin:0 0 .25rem}
.muted{color:#5b6660;font-size:.875rem;margin:0 0 1rem}
table{width:100%;border-collapse:collapse;margin:0 0 1rem}
td{padding:.35rem 0;border-bottom:1px solid #eee;vertical-align:top}
td.amount{text-align:right;white-space:nowrap;padding-left:1rem}
tr.total td{font-weight:700;border-bottom:0;padding-top:.6rem}
label{display:block;font-weight:600;margin-bottom:.35rem}
input{width:100%;font:inherit;padding:.6rem .7rem;border:1px solid #a9b1ab;border-radius:6px;letter-spacing:.08em}
input:focus{outline:3px solid #2f6b4f;outline-offset:1px}
button{margin-top:1rem;width:100%;font:inherit;font-weight:700;padding:.7rem;border:0;border-radius:6px;background:#2f6b4f;color:#fff;cursor:pointer}
button:hover{background:#24553e}
.error{background:#fdecea;border:1px solid #e0a39c;color:#8a1c12;border-radius:6px;padding:.6rem .8rem;margin:0 0 1rem}
.notice{background:#eef5f0;border:1px solid #b9d3c3;border-radius:6px;padding:.6rem .8rem;margin:0 0 1rem}
.hint{font-size:.8125rem;color:#5b6660;margin:.75rem 0 0}
.hint code{background:#f1efe9;padding:0 .25rem;border-radius:3px;white-space:nowrap}
.muted code{word-break:break-all;font-size:.8125rem}
.qty{display:block;color:#5b6660;font-size:.8125rem}
a{color:#2f6b4f}
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)} · TEST payment page (local fake)</title>
<style>${STYLE}</style>
</head>
<body>
<div class="banner" role="note">TEST payment page of the local payments fake: no real card is charged and no money moves.</div>
<main>
<div class="card">
${body}
</div>
</main>
</body>
</html>`;
}

/** Renders the payment page for a session in whatever state it is in. */
export function renderPayPage(view: PayPageView): string {
  const { session, lineItems } = view;
  const total = formatAmount(session.amount_total, session.currency);
  const rows = lineItems
    .map(
      (item) =>
        `<tr><td>${escapeHtml(item.description)}` +
        `<span class="qty">Qty ${item.quantity} × ${escapeHtml(formatAmount(item.price.unit_amount, item.currency))}</span></td>` +
        `<td class="amount">${escapeHtml(formatAmount(item.amount_total, item.currency))}</td></tr>`,
    )
    .join('\n');
  const summary = `<table aria-label="What you are paying for">
${rows}
<tr class="total"><td>Total</td><td class="amount">${escapeHtml(total)}</td></tr>
</table>`;

  if (session.status === 'complete') {
    const successUrl = session.success_url.split('{CHECKOUT_SESSION_ID}').join(session.id);
    return layout(
      'Already paid',
      `<h1>Already paid</h1>
<p class="muted">Test checkout <code>${escapeHtml(session.id)}</code></p>
${summary}
<p class="notice">This test payment of ${escapeHtml(total)} is complete.</p>
<p><a href="${escapeHtml(successUrl)}">Return to the site</a></p>`,
    );
  }
  if (session.status === 'expired') {
    return layout(
      'Checkout expired',
      `<h1>This checkout has expired</h1>
<p class="muted">Test checkout <code>${escapeHtml(session.id)}</code></p>
<p class="notice">Nothing was charged. Start the payment again from the site to get a new checkout.</p>
${session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Return to the site</a></p>` : ''}`,
    );
  }

  const error = view.errorMessage
    ? `<p class="error" role="alert" id="card-error">${escapeHtml(view.errorMessage)}</p>`
    : '';
  return layout(
    `Pay ${total}`,
    `<h1>Pay ${escapeHtml(total)}</h1>
<p class="muted">Test checkout <code>${escapeHtml(session.id)}</code>${session.customer_email ? ` for ${escapeHtml(session.customer_email)}` : ''}</p>
${summary}
${error}
<form method="post" action="/pay/${encodeURIComponent(session.id)}" novalidate>
<label for="card">Card number</label>
<input id="card" name="card" inputmode="numeric" autocomplete="cc-number" placeholder="4242 4242 4242 4242" autofocus required
 value="${escapeHtml(view.cardValue ?? '')}"${view.errorMessage ? ' aria-invalid="true" aria-describedby="card-error test-cards"' : ' aria-describedby="test-cards"'}>
<button type="submit">Pay ${escapeHtml(total)}</button>
</form>
<p class="hint" id="test-cards">Test cards: <code>4242 4242 4242 4242</code> pays · <code>4000 0000 0000 0002</code> is declined · <code>4000 0000 0000 9995</code> has insufficient funds. No expiry date or CVC is needed here.</p>
${session.cancel_url ? `<p class="hint"><a href="${escapeHtml(session.cancel_url)}">Cancel and return to the site</a></p>` : ''}`,
  );
}

/** Renders the page for an unknown session id. */
export function renderMissingSessionPage(sessionId: string): string {
  return layout(
    'Checkout not found',
    `<h1>Checkout not found</h1>
<p class="notice">The local payments fake has no checkout <code>${escapeHtml(sessionId)}</code>. It keeps state in memory, so a restart or a reset forgets earlier checkouts: start the payment again from the site.</p>`,
  );
}
