/**
 * Moving through a household's pages the way a person does at either screen size: the tab row on
 * a wide screen; on a phone the bottom bar, or its "More" sheet for the rest.
 */
import type { Locator, Page } from '@playwright/test';

/** The household navigation that is on screen now (tab row or bottom bar). */
export function householdNav(page: Page): Locator {
  return page.getByRole('navigation', { name: 'Household' }).filter({ visible: true });
}

/** The link to a destination, opening the phone's "More" sheet when it lives there. */
export async function householdLink(page: Page, label: string): Promise<Locator> {
  const nav = householdNav(page);
  const link = nav.getByRole('link', { name: label, exact: true });
  if (await link.isVisible()) return link;
  const more = page.getByTestId('more-menu');
  if (await more.isVisible()) {
    if ((await more.getAttribute('open')) === null) await more.locator('summary').click();
    return page.getByTestId('more-sheet').getByRole('link', { name: label, exact: true });
  }
  return link;
}

/** Goes to a destination by tapping it. */
export async function goToTab(page: Page, label: string): Promise<void> {
  await (await householdLink(page, label)).click();
}
