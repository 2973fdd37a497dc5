// A Lit reactive controller that keeps one solver result up to date with changing input:
// at most one request in flight, and only the newest input waits behind it (older inputs are
// dropped), so dragging never queues up stale work and the last result stays on screen.
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { SolverClient, SolverOutcome } from '../worker/SolverClient.ts';
import type { SolverRequest, SolverResults } from '../worker/protocol.ts';

/** State a view renders from. */
export interface LatestSolveState<K extends keyof SolverResults> {
  /** The last successful value (kept while newer work runs or after an error). */
  value: SolverResults[K] | null;
  /** The outcome of the newest finished request when it was not ok. */
  problem: Exclude<SolverOutcome<K>, { status: 'ok' }> | null;
  /** True while a request is running or waiting. */
  busy: boolean;
  /** Time from the newest input being given to its result arriving, ms (page clock). */
  latencyMs: number | null;
  /** Worker time of the newest result, ms. */
  workerMs: number | null;
}

/** Keeps the newest result of one request kind for a Lit element. */
export class LatestSolveController<K extends SolverRequest['kind']> implements ReactiveController {
  state: LatestSolveState<K> = { value: null, problem: null, busy: false, latencyMs: null, workerMs: null };
  private inFlight = false;
  private waiting: { request: Extract<SolverRequest, { kind: K }>; givenAt: number } | null = null;
  private connected = false;
  private generation = 0;

  constructor(
    private readonly host: ReactiveControllerHost,
    private readonly client: SolverClient,
    private readonly onResult?: (state: LatestSolveState<K>, givenAt: number) => void,
  ) {
    host.addController(this);
  }

  hostConnected(): void {
    this.connected = true;
  }

  hostDisconnected(): void {
    this.connected = false;
    this.waiting = null;
  }

  /** Gives new input; its result replaces the shown one when it arrives. */
  give(request: Extract<SolverRequest, { kind: K }>, givenAt: number = performance.now()): void {
    this.waiting = { request, givenAt };
    this.state = { ...this.state, busy: true };
    this.host.requestUpdate();
    if (!this.inFlight) void this.pump();
  }

  /** Forgets the shown result (e.g. when another bar is selected). */
  reset(): void {
    this.generation += 1;
    this.waiting = null;
    this.state = { value: null, problem: null, busy: false, latencyMs: null, workerMs: null };
    this.host.requestUpdate();
  }

  private async pump(): Promise<void> {
    while (this.waiting && this.connected) {
      const { request, givenAt } = this.waiting;
      this.waiting = null;
      this.inFlight = true;
      const generation = this.generation;
      const outcome = await this.client.request<K>(request);
      this.inFlight = false;
      if (generation !== this.generation) continue;
      const latencyMs = performance.now() - givenAt;
      if (outcome.status === 'ok') {
        this.state = { value: outcome.value, problem: null, busy: this.waiting !== null, latencyMs, workerMs: outcome.elapsedMs };
      } else {
        this.state = { ...this.state, problem: outcome, busy: this.waiting !== null, latencyMs };
      }
      this.host.requestUpdate();
      this.onResult?.(this.state, givenAt);
    }
  }
}
