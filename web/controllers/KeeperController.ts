// Connects a Lit element to the ProjectKeeper: the element re-renders whenever the open project
// or its saving state changes.
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { KeeperState, ProjectKeeper } from '../storage/ProjectKeeper.ts';

/** Re-renders its host on every keeper change. */
export class KeeperController implements ReactiveController {
  private unsubscribe: (() => void) | null = null;

  constructor(
    private readonly host: ReactiveControllerHost,
    readonly keeper: ProjectKeeper,
  ) {
    host.addController(this);
  }

  /** The keeper's state now. */
  get state(): KeeperState {
    return this.keeper.state;
  }

  hostConnected(): void {
    this.unsubscribe = this.keeper.subscribe(() => this.host.requestUpdate());
  }

  hostDisconnected(): void {
    this.unsubscribe?.();
    this.unsubscribe = null;
  }
}
