import { amountDueMinor, formatMinor } from '@panelpass/shared';

/** The words of the e-mails a customer receives after a visit (ours; plain text and HTML). */

const esc = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

function html(paragraphs: (string | string[])[]): string {
  const body = paragraphs
    .map((p) =>
      Array.isArray(p)
        ? `<ul>${p.map((li) => `<li>${esc(li)}</li>`).join('')}</ul>`
        : `<p>${esc(p).replace(/\n/g, '<br>')}</p>`,
    )
    .join('\n');
  return `<!doctype html><html><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #17201b">${body}</body></html>`;
}

function text(paragraphs: (string | string[])[]): string {
  return paragraphs
    .map((p) => (Array.isArray(p) ? p.map((li) => `- ${li}`).join('\n') : p))
    .join('\n\n');
}

export interface Written {
  subject: string;
  text: string;
  html: string;
}

export function receiptMail(a: {
  business: string;
  customer: string;
  vehicle: string;
  number: number;
  currency: string;
  totalMinor: number;
  payments: { kind: 'deposit' | 'balance' | 'refund'; status: string; amountMinor: number }[];
}): Written {
  const due = amountDueMinor(a.totalMinor, a.payments);
  const paid = a.totalMinor - due;
  const kind = a.totalMinor > 0 && due === 0 ? 'receipt' : 'invoice';
  const number = String(a.number).padStart(5, '0');
  const money = (n: number) => formatMinor(n, a.currency);
  const parts: (string | string[])[] = [
    `Hello ${a.customer},`,
    `Thank you for having your ${a.vehicle} looked after by ${a.business}. Your ${kind} no. ${number} is attached as a PDF.`,
    [
      `Total: ${money(a.totalMinor)}`,
      `Paid: ${money(paid)}`,
      due ? `Still to pay: ${money(due)}` : 'Paid in full',
    ],
    a.business,
  ];
  return {
    subject: `${kind === 'receipt' ? 'Receipt' : 'Invoice'} ${number} from ${a.business}`,
    text: text(parts),
    html: html(parts),
  };
}

export function reportMail(a: {
  business: string;
  customer: string;
  vehicle: string;
  care: string[];
}): Written {
  const parts: (string | string[])[] = [
    `Hello ${a.customer},`,
    `The job report for your ${a.vehicle} is attached: the condition we found on arrival, the paint film readings before and after, the work done panel by panel, the protection applied, and the signatures.`,
    'Looking after the finish:',
    a.care,
    a.business,
  ];
  return {
    subject: `Your job report: ${a.vehicle}`,
    text: text(parts),
    html: html(parts),
  };
}
