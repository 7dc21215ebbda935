/**
 * Care instructions sent with every job report, in our own words. General guidance for a
 * freshly corrected and protected finish; the protection product's own instructions govern
 * where they differ.
 */
export function careInstructions(opts: {
  keepDryUntil: string | null;
  hasChips: boolean;
  hasProtection: boolean;
}): string[] {
  const lines: string[] = [];
  if (opts.keepDryUntil) {
    lines.push(
      `Keep the car dry and unwashed until ${opts.keepDryUntil}: the protection is still curing, and water or washing before then can leave marks in it.`,
    );
  }
  lines.push(
    'Wash by hand, top down, with a pH-neutral car shampoo, a clean wash mitt and a second bucket of plain water to rinse the mitt in.',
    'Dry with a soft, clean drying towel or with filtered air; do not wipe a dusty or dry panel.',
    'Stay away from brush car washes: the brushes put back the fine scratches that were polished out.',
    'Rinse off bird droppings, tree sap and insects soon; left in the sun they etch into the finish.',
  );
  if (opts.hasChips) {
    lines.push(
      'Touched-up chips keep hardening for some weeks: do not polish, wax or use a pressure washer close to them for a month.',
    );
  }
  if (opts.hasProtection) {
    lines.push(
      "Follow the protection product's own care instructions where they differ from these, and ask us about a maintenance visit to keep it at its best.",
    );
  }
  return lines;
}
