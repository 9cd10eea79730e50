import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';

/**
 * Serious and critical WCAG 2 A/AA violations on the page as it stands, one line each.
 * Waits for the page to settle first: right after a server action React re-renders the head, and
 * an axe run in that instant finds no <title> although the page has one.
 */
export async function seriousViolations(page: Page): Promise<string[]> {
  await page.waitForLoadState('networkidle');
  await page.waitForFunction(() => document.title.trim() !== '');
  const results = await new AxeBuilder({ page }).withTags(['wcag2a', 'wcag2aa']).analyze();
  return results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(' ')).join(', ')}`);
}
