/**
 * Playwright's `test` with pages that wait, after every navigation, until the islands that hydrate
 * at load (`client:load`) are interactive: a tap on server-rendered HTML before React takes over
 * does nothing, and on a busy machine that race made tests flaky.
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

export const test = base.extend({
  page: async ({ page }, use) => {
    await use(waitForIslands(page));
  },
  context: async ({ context }, use) => {
    const newPage = context.newPage.bind(context);
    context.newPage = async () => waitForIslands(await newPage());
    await use(context);
  },
});

export { expect };
