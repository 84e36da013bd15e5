/**
 * Playwright's `test` with pages that wait, after every navigation, until the islands that hydrate
 * at load (`client:load`) are interactive: a tap on server-rendered HTML before React takes over
 * does nothing, and on a busy machine that race made tests flaky. Every page also fails its test
 * when the browser reports a Content-Security-Policy violation (a blocked script, style or worker):
 * the whole e2e suite checks that the policy breaks nothing.
 */
import { test as base, expect, type Page } from '@playwright/test';

const HYDRATED = () => !document.querySelector('astro-island[ssr][client="load"]');

/** Makes goto and reload on `page` return only once its load-time islands have hydrated. */
export function waitForIslands(page: Page): Page {
  const settle = () => page.waitForFunction(HYDRATED, null, { timeout: 15_000 }).catch(() => undefined);
  const goto = page.goto.bind(page);
  const reload = page.reload.bind(page);
  page.goto = async (...args) => {
    const r = await goto(...args);
    await settle();
    return r;
  };
  page.reload = async (...args) => {
    const r = await reload(...args);
    await settle();
    return r;
  };
  return page;
}

/** Collects the page's Content-Security-Policy violations, as Chromium reports them in the console. */
function watchPolicy(page: Page, violations: string[]): Page {
  page.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy/i.test(m.text())) violations.push(`${page.url()}: ${m.text()}`);
  });
  return page;
}

export const test = base.extend<{ policyViolations: string[] }>({
  policyViolations: async ({}, use) => {
    const violations: string[] = [];
    await use(violations);
    expect(violations, 'Content-Security-Policy violations').toEqual([]);
  },
  page: async ({ page, policyViolations }, use) => {
    await use(waitForIslands(watchPolicy(page, policyViolations)));
  },
  context: async ({ context, policyViolations }, use) => {
    const newPage = context.newPage.bind(context);
    context.newPage = async () => waitForIslands(watchPolicy(await newPage(), policyViolations));
    await use(context);
  },
});

export { expect };
