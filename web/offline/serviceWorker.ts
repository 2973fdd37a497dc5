// The workbench's service worker (built to sw.js by scripts/serviceWorkerPlugin.ts, which fills in
// the list of the build's files and a build id made from their contents). After one visit every
// file of the app is stored, so the workbench loads and works with no network: the page, its
// chunks, the workers, the demo project, the manifest and the icons. A new build installs beside
// the running one and waits: the page offers "reload to update" (appUpdates.ts) and the switch
// happens only when the page asks, after it has saved every change. The maker's projects live in
// IndexedDB, which this worker never touches.

/** Every file of this build, relative to the worker's scope (filled in at build time). */
declare const BARWRIGHT_PRECACHE: readonly string[];
/** Content hash of this build's files (filled in at build time). */
declare const BARWRIGHT_BUILD: string;

// The parts of the service-worker scope used here (the DOM library this project compiles with
// does not describe a service worker's global scope).
interface ExtendableEvent extends Event {
  waitUntil(promise: Promise<unknown>): void;
}
interface FetchEvent extends ExtendableEvent {
  readonly request: Request;
  respondWith(response: Response | Promise<Response>): void;
}
interface ExtendableMessageEvent extends ExtendableEvent {
  readonly data: unknown;
}
interface WorkerScope {
  readonly registration: { readonly scope: string };
  readonly clients: { claim(): Promise<void> };
  skipWaiting(): Promise<void>;
  addEventListener(type: 'install' | 'activate', listener: (event: ExtendableEvent) => void): void;
  addEventListener(type: 'fetch', listener: (event: FetchEvent) => void): void;
  addEventListener(type: 'message', listener: (event: ExtendableMessageEvent) => void): void;
}

const scope = self as unknown as WorkerScope;
const cachePrefix = 'barwright-app-';
const cacheName = `${cachePrefix}${BARWRIGHT_BUILD}`;
const base = scope.registration.scope;
const shellUrl = new URL('index.html', base).href;
const stored = new Set(BARWRIGHT_PRECACHE.map((path) => new URL(path, base).href));

scope.addEventListener('install', (event) => {
  // Fetch past the HTTP cache, so the stored copy is exactly this build's. Not skipWaiting: a
  // page running the previous version keeps it until the maker chooses to reload.
  event.waitUntil(caches.open(cacheName).then((cache) => cache.addAll([...stored].map((url) => new Request(url, { cache: 'reload' })))));
});

scope.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys()) if (name.startsWith(cachePrefix) && name !== cacheName) await caches.delete(name);
      // The first visit's page works offline at once, without a second load.
      await scope.clients.claim();
    })(),
  );
});

scope.addEventListener('message', (event) => {
  const data = event.data as { type?: unknown } | null;
  if (data?.type === 'activate-update') event.waitUntil(scope.skipWaiting());
});

scope.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  url.hash = '';
  // Opening the workbench (any address in its scope the app itself does not serve as a file:
  // the views live in the #fragment) gets the stored page.
  const key = request.mode === 'navigate' && url.href.startsWith(base) && !stored.has(url.href) ? shellUrl : url.href;
  if (!stored.has(key)) return;
  event.respondWith(
    (async () => {
      const cache = await caches.open(cacheName);
      const hit = await cache.match(key);
      return hit ?? fetch(request);
    })(),
  );
});
