// The page's side of the service worker (serviceWorker.ts): registers it, notices when a new
// version of the workbench has been stored and is waiting, and switches to it only when the
// maker asks and every change is saved. A version that another tab switched to is reported too.

/** What the page knows about versions of the workbench. */
export interface AppUpdateState {
  /** A new version is stored and waits for "reload to update". */
  waiting: boolean;
  /** Another tab switched to a new version: this tab still runs the old one until it reloads. */
  activeElsewhere: boolean;
  /** The service worker could not be registered (the app still works online), or null. */
  problem: string | null;
}

/**
 * Asks the app shell to store every change before a reload. The shell's listener sets `saved` to
 * a promise of true when nothing is left unsaved (false: a change could not be stored, so the
 * reload must wait). Dispatched from bw-update-notice; bubbles through shadow roots.
 */
export class SaveBeforeUpdateEvent extends Event {
  saved: Promise<boolean> | null = null;
  constructor() {
    super('save-before-update', { bubbles: true, composed: true });
  }
}

/** Message the page posts to a waiting service worker: take over now. */
const activateMessage = { type: 'activate-update' } as const;

class AppUpdates {
  state: AppUpdateState = { waiting: false, activeElsewhere: false, problem: null };
  private readonly listeners = new Set<(state: AppUpdateState) => void>();
  private registration: ServiceWorkerRegistration | null = null;
  private reloadRequested = false;

  subscribe(listener: (state: AppUpdateState) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  private set(change: Partial<AppUpdateState>): void {
    this.state = { ...this.state, ...change };
    for (const listener of this.listeners) listener(this.state);
  }

  /** Registers the service worker at `url` and watches for new versions. */
  async register(url: URL): Promise<void> {
    const container = navigator.serviceWorker;
    // A page loaded without a controller (the first visit) is taken over once the worker has
    // stored the app: that is not a new version.
    let controlled = container.controller !== null;
    container.addEventListener('controllerchange', () => {
      if (this.reloadRequested) location.reload();
      else if (controlled) this.set({ activeElsewhere: true, waiting: false });
      controlled = true;
    });
    let registration: ServiceWorkerRegistration;
    try {
      registration = await container.register(url, { scope: './' });
    } catch (error) {
      this.set({ problem: `The workbench could not store itself for offline use: ${error instanceof Error ? error.message : String(error)}` });
      return;
    }
    this.registration = registration;
    const watch = (worker: ServiceWorker | null) => {
      if (!worker) return;
      const check = () => {
        // Installed while an older version controls the page: it waits for the maker.
        if (worker.state === 'installed' && container.controller) this.set({ waiting: true });
      };
      check();
      worker.addEventListener('statechange', check);
    };
    watch(registration.waiting);
    watch(registration.installing);
    registration.addEventListener('updatefound', () => watch(registration.installing));
  }

  /** Looks for a new version now (the browser also looks on every visit). */
  async check(): Promise<void> {
    await this.registration?.update();
  }

  /**
   * Switches to the waiting version (or, after another tab switched, reloads into it). The caller
   * has stored every change first (SaveBeforeUpdateEvent).
   */
  reloadIntoNewVersion(): void {
    const waiting = this.registration?.waiting;
    if (waiting) {
      this.reloadRequested = true;
      waiting.postMessage(activateMessage);
    } else location.reload();
  }
}

/** The page's one view of workbench versions. */
export const appUpdates = new AppUpdates();

/** Registers the service worker (the built app only; see main.ts). */
export function registerServiceWorker(url: URL): Promise<void> {
  return appUpdates.register(url);
}
