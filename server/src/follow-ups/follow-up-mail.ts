/** The words of the follow-up e-mails (ours; plain text and HTML). */

const esc = (s: string): string =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

export interface Written {
  subject: string;
  text: string;
  html: string;
}

function written(subject: string, paragraphs: string[]): Written {
  return {
    subject,
    text: paragraphs.join('\n\n'),
    html: `<!doctype html><html><body style="font-family: system-ui, sans-serif; line-height: 1.5; color: #17201b">${paragraphs
      .map((p) => `<p>${esc(p).replace(/\n/g, '<br>')}</p>`)
      .join('\n')}</body></html>`,
  };
}

/** Months as words people say: "6 months", "a year", "18 months". */
export function monthsInWords(months: number): string {
  if (months === 1) return 'a month';
  if (months === 12) return 'a year';
  if (months % 12 === 0) return `${months / 12} years`;
  return `${months} months`;
}

export function maintenanceMail(a: {
  business: string;
  customer: string;
  vehicle: string;
  months: number;
  closedOn: string;
}): Written {
  return written(`Time for a check-up on your ${a.vehicle}`, [
    `Hello ${a.customer},`,
    `It has been ${monthsInWords(a.months)} since we corrected and protected the paint on your ${a.vehicle} (${a.closedOn}).`,
    'Protection lasts longest with a little care along the way: a gentle maintenance wash, a look at how the water still beads and sheets, and a top-up where the surface has tired. It takes far less time than the first visit.',
    'If you would like us to come by, just reply to this e-mail with a few days that suit you.',
    a.business,
  ]);
}

export function appointmentMail(a: {
  business: string;
  customer: string;
  vehicle: string;
  window: string;
  address: string;
}): Written {
  const where = a.address ? ` at ${a.address}` : '';
  return written(`See you tomorrow: ${a.vehicle}`, [
    `Hello ${a.customer},`,
    `A reminder that we are booked to look after your ${a.vehicle} tomorrow, ${a.window}${where}.`,
    'It helps if the vehicle is somewhere we can walk all the way around it, out of direct sun if you can manage it. We bring our own water and power unless we agreed otherwise.',
    'If the time no longer suits, reply to this e-mail and we will find another.',
    a.business,
  ]);
}
