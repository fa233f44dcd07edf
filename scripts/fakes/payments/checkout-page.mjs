// The hosted checkout page: the buyer sees what they are buying and approves or declines.
const esc = (s) =>
  String(s).replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c],
  );

const money = (cents, currency) => `${(cents / 100).toFixed(2)} ${currency.toUpperCase()}`;

export function checkoutPage(session, customer) {
  const item = session.line_items[0];
  const closed = session.status !== 'open';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Confirm your subscription</title>
<meta name="viewport" content="width=device-width, initial-scale=1">
<style>
  body { font: 16px/1.5 system-ui, sans-serif; background: #f3f1ec; color: #222; margin: 0; }
  main { max-width: 420px; margin: 8vh auto; background: #fff; border-radius: 10px; padding: 28px;
         box-shadow: 0 2px 10px rgba(0,0,0,.08); }
  h1 { font-size: 20px; margin: 0 0 4px; }
  .note { font-size: 13px; color: #666; }
  .total { font-size: 28px; margin: 18px 0; }
  form { display: inline; }
  button { font: inherit; padding: 10px 18px; border-radius: 6px; border: 1px solid #444; cursor: pointer; }
  .yes { background: #24523b; color: #fff; border-color: #24523b; }
  .no { background: #fff; }
</style></head>
<body><main>
  <p class="note">Local payments test service — no real money moves.</p>
  <h1>${esc(item.name)}</h1>
  <p class="note">For ${esc(customer?.email ?? 'your account')}</p>
  <p class="total">${esc(money(item.unit_amount, item.currency))} <span class="note">every ${esc(item.interval)}</span></p>
  ${
    closed
      ? `<p><strong>This checkout is ${esc(session.status === 'complete' ? 'complete' : 'closed')}.</strong></p>`
      : `<form method="post" action="/checkout/${esc(session.id)}/approve"><button class="yes" type="submit">Approve payment</button></form>
  <form method="post" action="/checkout/${esc(session.id)}/decline"><button class="no" type="submit">Decline</button></form>`
  }
</main></body></html>`;
}
