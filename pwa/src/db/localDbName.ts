/** The name of one user's database on the phone (kept apart from Dexie so startup code can name it). */
export function localDbName(userId: string): string {
  return `panelpass-${userId}`;
}
