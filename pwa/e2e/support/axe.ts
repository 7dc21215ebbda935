import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { Page } from 'playwright-core';

/** axe-core's browser build, from the installed package (nothing fetched). */
const axePath = join(dirname(createRequire(import.meta.url).resolve('axe-core')), 'axe.min.js');

export interface AxeFinding {
  /** Which screen or sheet was checked. */
  screen: string;
  rule: string;
  impact: string;
  help: string;
  /** The first few elements it was found on, with what is wrong. */
  where: string[];
}

/**
 * Runs axe-core on what the page shows now and answers its violations. The page's context
 * must bypass the app's Content-Security-Policy (`script-src 'self'`), which refuses the
 * injected script otherwise.
 */
export async function axeFindings(page: Page, screen: string): Promise<AxeFinding[]> {
  // Sheets slide in and fade their backdrop: colours are judged once nothing moves.
  // (Endless ones, a spinner or a pulse, are not waited for.)
  await page.waitForFunction(
    () =>
      [...document.querySelectorAll('ion-modal.show-modal')].every((modal) => {
        const wrapper = modal.shadowRoot?.querySelector('.modal-wrapper');
        return !wrapper || getComputedStyle(wrapper).opacity === '1';
      }) &&
      document
        .getAnimations()
        .every((a) => a.playState !== 'running' || a.effect?.getTiming().iterations === Infinity),
    null,
    { timeout: 5000 },
  );
  const loaded = await page.evaluate(() => 'axe' in window);
  if (!loaded) await page.addScriptTag({ path: axePath });
  const found = await page.evaluate(async () => {
    const axe = (
      window as unknown as {
        axe: {
          run(
            context: Document,
            options: { resultTypes: string[] },
          ): Promise<{
            violations: {
              id: string;
              impact: string | null;
              help: string;
              nodes: { target: unknown[]; failureSummary?: string }[];
            }[];
          }>;
        };
      }
    ).axe;
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      rule: v.id,
      impact: v.impact ?? 'unknown',
      help: v.help,
      where: v.nodes
        .slice(0, 3)
        .map(
          (n) =>
            `${n.target.map(String).join(' ')} — ${(n.failureSummary ?? '').split('\n').slice(1).join(' ').trim()}`,
        ),
    }));
  });
  return found.map((f) => ({ screen, ...f }));
}

/** Serious and critical findings: what a test refuses. */
export const blocking = (f: AxeFinding) => f.impact === 'serious' || f.impact === 'critical';

/** One line per finding, for the test's output. */
export function describeFindings(findings: readonly AxeFinding[]): string {
  return findings
    .map((f) => `[${f.impact}] ${f.screen}: ${f.rule} (${f.help})\n    ${f.where.join('\n    ')}`)
    .join('\n');
}
