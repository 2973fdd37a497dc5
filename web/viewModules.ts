// The workbench's views beyond the keyboard overview load on demand: the page starts with the
// shell, the keyboard view and the storage, and each other view (with what only it uses, such
// as chart.js) comes as its own chunk. The service worker stores every chunk, so a view opens
// offline as well; once the page is idle every view is fetched, so switching never waits.
import type { ViewName } from './events.ts';

const loaders: Partial<Record<ViewName, () => Promise<unknown>>> = {
  shape: () => import('./components/bw-shape-view.ts'),
  tuning: () => import('./components/bw-tuning-view.ts'),
  resonators: () => import('./components/bw-resonator-view.ts'),
  template: () => import('./components/bw-template-view.ts'),
  chimes: () => import('./components/bw-chime-view.ts'),
  workshop: () => import('./components/bw-workshop-view.ts'),
  'plan-print': () => import('./components/bw-plan-print-view.ts'),
};

const loading = new Map<ViewName, Promise<unknown>>();

/**
 * Loads the module defining a view's element (once; later calls share the first). The element
 * already on the page upgrades when its definition arrives, keeping the properties it was given.
 */
export function loadView(view: ViewName): Promise<unknown> {
  const loader = loaders[view];
  if (!loader) return Promise.resolve();
  let pending = loading.get(view);
  if (!pending) {
    pending = loader().catch((error: unknown) => {
      loading.delete(view);
      console.error(`The ${view} view could not be loaded: ${error instanceof Error ? error.message : String(error)}`);
    });
    loading.set(view, pending);
  }
  return pending;
}

/** Fetches every view once the page has nothing else to do. */
export function preloadViews(): void {
  const start = () => {
    for (const view of Object.keys(loaders) as ViewName[]) void loadView(view);
  };
  if ('requestIdleCallback' in window) requestIdleCallback(start, { timeout: 2000 });
  else setTimeout(start, 200);
}
