/**
 * The page's side of the service worker's caches (astro.config.mjs).
 *
 * `clearRuntimeCaches` empties the runtime caches (the household pages and API lists kept for use
 * with no signal) at sign-in and sign-out: the next person on the same phone never opens the last
 * one's household pages offline. The built files and the offline page stay (they hold no household
 * data), and so do entries waiting to send (kept per person, src/components/entries/entry-queue.ts).
 *
 * `keepFirstVisit`: on the very first visit the page loads before the worker controls it, so the
 * worker keeps nothing of it. When the worker takes control, the page asks again — through the
 * worker now — for itself and the API lists it read, when the worker's routes keep them; so "opens
 * offline after one visit" holds for the first visit too.
 */
import { offlineRoutes, RUNTIME_CACHES } from '@/lib/app-cache';

export async function clearRuntimeCaches(): Promise<void> {
  if (typeof caches === 'undefined') return;
  await Promise.all(Object.values(RUNTIME_CACHES).map((name) => caches.delete(name).catch(() => false)));
}

export function keepFirstVisit(): void {
  if (!('serviceWorker' in navigator) || navigator.serviceWorker.controller) return;
  const again = () => {
    const { pages, lists } = offlineRoutes();
    const loaded = performance.getEntriesByType('resource').map((e) => e.name);
    const urls = new Set([location.href, ...loaded].filter((u) => pages.test(u) || lists.test(u)));
    for (const url of urls) void fetch(url, { credentials: 'same-origin' }).catch(() => undefined);
  };
  navigator.serviceWorker.addEventListener('controllerchange', again, { once: true });
}
