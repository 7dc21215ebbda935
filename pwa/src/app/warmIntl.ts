/**
 * A page's first Intl formatter loads the locale's data: 15–70 ms on a desktop, several times that
 * on a phone, and Today's first render makes one (the date line), as do the units and times on
 * most screens. Called as a signed-in start begins, this makes a date formatter and then a number
 * formatter, each in a task of its own while the app's code is still arriving, so that cost is
 * paid while the main thread would wait anyway, and not inside the render of the first screen.
 * Later formatters of the same kinds take well under a millisecond.
 */
export function warmIntl(later: (run: () => void) => void = (run) => setTimeout(run, 0)): void {
  later(() => {
    new Intl.DateTimeFormat(undefined, { weekday: 'long', day: 'numeric', month: 'long' }).format(
      0,
    );
    later(() => {
      new Intl.NumberFormat(undefined, { maximumFractionDigits: 1 }).format(0.5);
    });
  });
}
