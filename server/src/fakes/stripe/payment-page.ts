/**
 * The customer's card page of the local payment stand-in: plain HTML and inline styles, no
 * script and nothing fetched from anywhere else. It exists so the whole card flow can run
 * on one machine; the test card numbers it takes are listed on the page.
 */

export const TEST_CARDS = {
  succeeds: '4242424242424242',
  declined: '4000000000000002',
  authenticate: '4000002500003155',
} as const;

const esc = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

export function money(amountMinor: number, currency: string): string {
  const code = currency.toUpperCase();
  try {
    const digits =
      new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions()
        .maximumFractionDigits ?? 2;
    return new Intl.NumberFormat('en-US', { style: 'currency', currency: code }).format(
      amountMinor / 10 ** digits,
    );
  } catch {
    return `${amountMinor} ${code}`;
  }
}

const STYLE = `
  * { box-sizing: border-box; }
  body { margin: 0; font: 17px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, sans-serif;
         background: #eef1ee; color: #17201b; }
  main { max-width: 27rem; margin: 0 auto; padding: 1.25rem 1rem 3rem; }
  .band { background: #24453a; color: #fff; padding: .6rem 1rem; font-size: .85rem;
          letter-spacing: .02em; text-align: center; }
  .card { background: #fff; border-radius: 14px; padding: 1.25rem; margin-top: 1rem;
          box-shadow: 0 1px 3px rgba(0,0,0,.12); }
  h1 { font-size: 1.15rem; margin: 0 0 .25rem; }
  .amount { font-size: 2rem; font-weight: 700; margin: .25rem 0 1rem; }
  label { display: block; font-weight: 600; margin: .9rem 0 .3rem; }
  input { width: 100%; font: inherit; padding: .7rem .8rem; border: 2px solid #9aa69f;
          border-radius: 10px; background: #fff; color: inherit; }
  input:focus { outline: 3px solid #e0a526; outline-offset: 1px; border-color: #24453a; }
  .row { display: flex; gap: .75rem; } .row > div { flex: 1; }
  button { width: 100%; margin-top: 1.25rem; font: inherit; font-weight: 700; padding: .9rem;
           border: 0; border-radius: 10px; background: #24453a; color: #fff; cursor: pointer; }
  button.second { background: #fff; color: #8a1f11; border: 2px solid #8a1f11; }
  .error { background: #fde8e4; color: #7a1a0d; border-left: 5px solid #b3261e;
           padding: .7rem .9rem; border-radius: 8px; margin-top: 1rem; }
  .done { background: #e2f3e7; color: #14452a; border-left: 5px solid #2e7d4f;
          padding: .7rem .9rem; border-radius: 8px; }
  details { margin-top: 1.25rem; font-size: .9rem; color: #3d4a43; }
  code { font-size: .95em; }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${esc(title)}</title><style>${STYLE}</style></head>
<body><div class="band">Test payment — no real card is charged</div><main>${body}</main></body></html>`;
}

export interface PageSession {
  id: string;
  description: string;
  amountMinor: number;
  currency: string;
}

/** The card form; `error` shows what went wrong with the last try. */
export function cardPage(s: PageSession, error?: string, name = ''): string {
  return layout(
    `Pay ${money(s.amountMinor, s.currency)}`,
    `<div class="card">
  <h1>${esc(s.description)}</h1>
  <div class="amount">${money(s.amountMinor, s.currency)}</div>
  <form method="post" action="/pay/${esc(s.id)}" autocomplete="on">
    <label for="card">Card number</label>
    <input id="card" name="card" inputmode="numeric" autocomplete="cc-number" required
      placeholder="1234 1234 1234 1234" aria-describedby="cards">
    <div class="row">
      <div><label for="exp">Expiry (MM/YY)</label>
        <input id="exp" name="exp" inputmode="numeric" autocomplete="cc-exp" required placeholder="MM/YY"></div>
      <div><label for="cvc">Security code</label>
        <input id="cvc" name="cvc" inputmode="numeric" autocomplete="cc-csc" required placeholder="123"></div>
    </div>
    <label for="name">Name on card</label>
    <input id="name" name="name" autocomplete="cc-name" value="${esc(name)}">
    ${error ? `<div class="error" role="alert">${esc(error)}</div>` : ''}
    <button type="submit">Pay ${money(s.amountMinor, s.currency)}</button>
  </form>
  <details id="cards"><summary>Test card numbers</summary>
    <p><code>${TEST_CARDS.succeeds}</code> is paid.<br>
    <code>${TEST_CARDS.declined}</code> is declined.<br>
    <code>${TEST_CARDS.authenticate}</code> asks the card holder to approve first.<br>
    Any future expiry date and any three digits.</p></details>
</div>`,
  );
}

/** The extra step a card asks for before it pays. */
export function approvePage(s: PageSession): string {
  return layout(
    'Approve the payment',
    `<div class="card">
  <h1>Your card asks you to approve this payment</h1>
  <div class="amount">${money(s.amountMinor, s.currency)}</div>
  <p>${esc(s.description)}</p>
  <form method="post" action="/pay/${esc(s.id)}/approve">
    <button type="submit" name="decision" value="approve">Approve</button>
    <button type="submit" name="decision" value="refuse" class="second">Do not approve</button>
  </form>
</div>`,
  );
}

/** A link that takes no more payments: paid already, or expired. */
export function closedPage(s: PageSession, state: 'complete' | 'expired'): string {
  return layout(
    state === 'complete' ? 'Paid' : 'Link expired',
    `<div class="card">
  <h1>${esc(s.description)}</h1>
  <div class="amount">${money(s.amountMinor, s.currency)}</div>
  ${
    state === 'complete'
      ? '<p class="done" role="status">This has been paid. Thank you.</p>'
      : '<p class="error" role="alert">This payment link has expired. Ask for a new one.</p>'
  }
</div>`,
  );
}

export function notFoundPage(): string {
  return layout(
    'Not found',
    '<div class="card"><h1>There is no payment here</h1><p>Check the link you were sent.</p></div>',
  );
}
