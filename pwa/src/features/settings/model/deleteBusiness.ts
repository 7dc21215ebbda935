/**
 * Whether what the owner typed is the business's name, as the server checks it: exactly,
 * capitals included, with spaces around either ignored. An empty name never matches.
 */
export function typedNameMatches(typed: string, name: string): boolean {
  const want = name.trim();
  return want !== '' && typed.trim() === want;
}

/** What the sign-in screen says after the business was deleted. */
export function deletedNote(name: string): string {
  return `“${name.trim()}” was deleted, with everything in it. Everyone was signed out, and this phone's copy is gone.`;
}
