// A Lit reactive controller owning one chart.js line chart: builds it on the element's canvas,
// refreshes it in place when the data change, rebuilds it when the canvas was re-rendered, and
// releases it when the element leaves the page. Presentation only; the data come from the host.
import type { ReactiveController, ReactiveControllerHost } from 'lit';
import type { ChartDataset, ChartOptions } from 'chart.js';
import { Chart } from '../charts/chartSetup.ts';

/** One line chart for a Lit element. */
export class LineChartController implements ReactiveController {
  private chart: Chart<'line', { x: number; y: number }[]> | null = null;

  constructor(host: ReactiveControllerHost) {
    host.addController(this);
  }

  /**
   * Shows `datasets` with `options` on `canvas` (call from the host's `updated`). A missing canvas
   * drops the chart; a different canvas than last time gets a new chart; otherwise the chart is
   * updated in place (options replaced whole, so scale limits follow the host's state).
   */
  draw(canvas: HTMLCanvasElement | null, datasets: ChartDataset<'line', { x: number; y: number }[]>[], options: ChartOptions<'line'>): void {
    if (!canvas) {
      this.release();
      return;
    }
    if (this.chart && this.chart.canvas !== canvas) this.release();
    if (!this.chart) {
      this.chart = new Chart(canvas, { type: 'line', data: { datasets }, options });
      return;
    }
    this.chart.data.datasets = datasets;
    this.chart.options = options;
    this.chart.update();
  }

  hostDisconnected(): void {
    this.release();
  }

  private release(): void {
    this.chart?.destroy();
    this.chart = null;
  }
}
