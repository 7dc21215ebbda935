// Its own module: the timer banner on every screen needs it without the rest of the time words.

/** "14:32" (or "2:32 PM" where the phone's language says so). */
export function clockTime(ms: number, locale?: string): string {
  return shortTimeFormat(locale).format(ms);
}

/** One formatter per locale, made once: making one costs far more than formatting with it. */
const shortTimeFormats = new Map<string, Intl.DateTimeFormat>();
function shortTimeFormat(locale: string | undefined): Intl.DateTimeFormat {
  const key = locale ?? '';
  let format = shortTimeFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(locale, { timeStyle: 'short' });
    shortTimeFormats.set(key, format);
  }
  return format;
}
