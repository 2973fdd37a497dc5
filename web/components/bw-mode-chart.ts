// Mode shapes along the bar (deflection against position in mm) with each mode's nodes marked,
// plotted with chart.js. Lines differ by dash and point shape, not only colour.
import { LitElement, html, css } from 'lit';
import { customElement, property } from 'lit/decorators.js';
import { seriesStyles } from '../charts/chartSetup.ts';
import { LineChartController } from '../controllers/LineChartController.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatHz, formatMm, partialName } from '../format.ts';

/** One mode to plot. */
export interface PlottedMode {
  mode: number;
  hz: number;
  nodes_mm: number[];
  shape?: { x_mm: number[]; displacement: number[] };
  /** What to call it (default: the partial's name, e.g. "Fundamental"). */
  name?: string;
}

/** `<bw-mode-chart .modes>` */
@customElement('bw-mode-chart')
export class BwModeChart extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      .frame {
        position: relative;
        height: 260px;
      }
    `,
  ];

  @property({ attribute: false }) modes: PlottedMode[] = [];
  /** Bar length, mm (the x axis ends there). */
  @property({ type: Number, attribute: 'length' }) lengthMm: number | null = null;
  /** What the curve shows (the y axis title). */
  @property() quantity = 'Deflection (scaled)';
  private readonly lineChart = new LineChartController(this);

  protected override render() {
    const described = this.modes.map((mode) => `${mode.name ?? partialName(mode.mode - 1)} (${formatHz(mode.hz)} Hz): nodes at ${mode.nodes_mm.map((x) => formatMm(x)).join(', ')} mm`).join('; ');
    return html`<div class="frame"><canvas role="img" aria-label=${`Mode shapes. ${described}`}></canvas></div>`;
  }

  protected override updated(): void {
    const canvas = this.renderRoot.querySelector('canvas');
    if (!canvas) return;
    const datasets = this.modes.flatMap((mode, index) => {
      const style = seriesStyles[index % seriesStyles.length]!;
      const shape = mode.shape;
      if (!shape) return [];
      return [
        {
          label: `${mode.name ?? partialName(mode.mode - 1)} · ${formatHz(mode.hz)} Hz`,
          data: shape.x_mm.map((x, i) => ({ x, y: shape.displacement[i]! })),
          borderColor: style.color,
          backgroundColor: style.color,
          borderDash: style.dash,
          borderWidth: 2.5,
          pointRadius: 0,
          pointStyle: style.point,
        },
        {
          label: `Nodes of ${(mode.name ?? partialName(mode.mode - 1)).toLowerCase()}`,
          data: mode.nodes_mm.map((x) => ({ x, y: 0 })),
          borderColor: style.color,
          backgroundColor: '#ffffff',
          showLine: false,
          pointRadius: 7,
          pointBorderWidth: 2,
          pointStyle: style.point,
        },
      ];
    });
    this.lineChart.draw(canvas, datasets, {
      responsive: true,
      maintainAspectRatio: false,
      parsing: false,
      scales: {
        x: { type: 'linear', min: 0, max: this.lengthMm ?? undefined, title: { display: true, text: 'Position from the left end (mm)' } },
        y: { title: { display: true, text: this.quantity }, min: -1.1, max: 1.1 },
      },
      plugins: { legend: { labels: { usePointStyle: true, filter: (item) => !item.text.startsWith('Nodes') } } },
    });
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-mode-chart': BwModeChart;
  }
}
