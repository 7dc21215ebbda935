/** What the page the card payment page sends the customer back to says, from its query. */
export interface PaidPageWords {
  title: string;
  tone: 'done' | 'info';
  notice: string;
  lead: string;
}

export function paidPageWords(search: string): PaidPageWords {
  if (new URLSearchParams(search).get('cancelled') === '1') {
    return {
      title: 'No payment taken',
      tone: 'info',
      notice: 'You turned back before paying, so nothing was taken from your card.',
      lead:
        'You can pay later from the same link or from the page the detailer e-mailed you, or ' +
        'settle up with them in person. You can close this page.',
    };
  }
  return {
    title: 'Thank you: payment made',
    tone: 'done',
    notice: 'Your card payment has gone through. There is nothing more to do here.',
    lead:
      "Your receipt and the report of the work are on their way to you by e-mail. The detailer's " +
      'phone shows the payment as soon as it next connects. You can close this page.',
  };
}
