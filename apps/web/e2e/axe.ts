import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import type { AxeResults } from 'axe-core';
import type { Page } from 'playwright-core';

const require = createRequire(import.meta.url);
let axeSource: Promise<string> | undefined;

export interface AxeViolation {
  id: string;
  impact: string;
  help: string;
  /** CSS selectors of the offending elements. */
  targets: string[];
}

/**
 * Runs axe-core in the page and returns its serious and critical violations (WCAG 2.x A and AA
 * rules plus axe's best practices). The source goes in through the DevTools protocol, so a
 * Content-Security-Policy that forbids inline scripts does not stop it.
 */
export async function seriousAxeViolations(page: Page): Promise<AxeViolation[]> {
  axeSource ??= readFile(require.resolve('axe-core/axe.min.js'), 'utf8');
  const source = await axeSource;
  await page.evaluate(source);
  return page.evaluate(async () => {
    const { axe } = window as unknown as {
      axe: { run: (context: Document, options: object) => Promise<AxeResults> };
    };
    const result = await axe.run(document, { resultTypes: ['violations'] });
    return result.violations
      .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
      .map((violation) => ({
        id: violation.id,
        impact: violation.impact ?? 'unknown',
        help: violation.help,
        targets: violation.nodes.map((node) => node.target.join(' ')),
      }));
  });
}
