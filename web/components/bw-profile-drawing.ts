// The bar's side profile drawn to scale in millimetres: flat top, undercut below (hatched), the
// stations with their thicknesses, cord holes at the fundamental's nodes, and optionally the
// next cut shaded. Editable: drag anywhere to move the nearest station's depth (neighbours
// follow smoothly), or focus it and use the arrow keys. Fires `profile-preview` while dragging
// and `profile-commit` when a change is finished.
import { LitElement, html, svg, css, nothing } from 'lit';
import { customElement, property, state } from 'lit/decorators.js';
import { withSmoothDepthChange, type BarFile, type CutInstructions } from '../../src/index.ts';
import { sharedStyles } from '../styles/sharedStyles.ts';
import { formatMm } from '../format.ts';

/** Detail of `profile-preview` and `profile-commit`. */
export interface ProfileChangeDetail {
  bar: BarFile;
  /** performance.now() of the input that produced this shape. */
  at: number;
}

/** Margins around the drawing, mm of drawing space. */
const margin = { left: 14, right: 14, top: 24, bottom: 26 };

/** `<bw-profile-drawing .bar .cutTo .nodesMm editable>` */
@customElement('bw-profile-drawing')
export class BwProfileDrawing extends LitElement {
  static override styles = [
    sharedStyles,
    css`
      :host {
        display: block;
      }
      svg {
        width: 100%;
        height: auto;
        display: block;
        touch-action: none;
        user-select: none;
      }
      svg.editable {
        cursor: ns-resize;
      }
      .wood {
        fill: var(--bw-wood);
        stroke: var(--bw-wood-edge);
      }
      .removed {
        fill: url(#bw-hatch);
        stroke: none;
      }
      .to-cut {
        fill: var(--bw-cut);
        fill-opacity: 0.55;
        stroke: var(--bw-cut);
      }
      .station {
        fill: #ffffff;
        stroke: var(--bw-ink);
      }
      .station.selected {
        fill: var(--bw-focus);
        stroke: var(--bw-ink);
      }
      .node-line {
        stroke: var(--bw-action);
        stroke-dasharray: 2 1.5;
      }
      .node-mark {
        fill: #ffffff;
        stroke: var(--bw-action);
      }
      text {
        fill: var(--bw-ink);
        font-family: var(--bw-font);
      }
      .ruler {
        stroke: var(--bw-ink-muted);
      }
      .caption {
        font-size: 0.9rem;
        color: var(--bw-ink-muted);
        margin: 0.3rem 0 0;
      }
      .focus-ring {
        fill: none;
        stroke: var(--bw-focus);
      }
      svg:focus {
        outline: none;
      }
      svg:focus-visible {
        outline: 3px solid var(--bw-focus);
        outline-offset: 2px;
      }
    `,
  ];

  /** The bar to draw (its present shape). */
  @property({ attribute: false }) bar: BarFile | null = null;
  /** The shape after the next cut, shaded as material to remove. */
  @property({ attribute: false }) cutTo: BarFile | null = null;
  /** The cut written out (library's cut instructions): drawn magnified in a strip under the bar. */
  @property({ attribute: false }) cut: CutInstructions | null = null;
  /** Node positions of the fundamental (cord holes), mm from the left end. */
  @property({ attribute: false }) nodesMm: number[] = [];
  /** Allow dragging and keyboard editing of station depths. */
  @property({ type: Boolean }) editable = false;
  /** Thinnest allowed thickness, mm. */
  @property({ type: Number, attribute: 'min-thickness' }) minThicknessMm = 1;
  /** Half-width over which neighbouring stations follow a drag, mm (0 = single station). */
  @property({ type: Number }) spread = 30;

  @state() private selected = -1;
  @state() private preview: BarFile | null = null;
  private dragStart: BarFile | null = null;
  private dragIndex = -1;
  /** Drawing-space offset from the pointer to the grabbed station (no jump when grabbing). */
  private dragOffset = 0;

  private get shown(): BarFile | null {
    return this.preview ?? this.bar;
  }

  protected override willUpdate(changed: Map<string, unknown>): void {
    if (changed.has('bar') && !this.dragStart) this.preview = null;
  }

  /** Vertical exaggeration: the drawn height is about a fifth of the length. */
  private exaggeration(bar: BarFile): number {
    const height = bar.section.shape === 'rect' ? bar.section.thickness_mm : bar.section.shape === 'tube' ? bar.section.outer_diameter_mm : bar.section.diameter_mm;
    return Math.max(1, Math.min(8, Math.round((0.2 * bar.length_mm) / height)));
  }

  private toDrawing(event: PointerEvent): { x: number; y: number } | null {
    const svgElement = this.renderRoot.querySelector('svg');
    const matrix = svgElement?.getScreenCTM();
    if (!svgElement || !matrix) return null;
    const point = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse());
    return { x: point.x - margin.left, y: point.y - margin.top };
  }

  private nearestStation(bar: BarFile, x: number): number {
    const profile = bar.profile_mm ?? [];
    let best = -1;
    let bestDistance = Infinity;
    profile.forEach(([position], index) => {
      const distance = Math.abs(position - x);
      if (distance < bestDistance) {
        bestDistance = distance;
        best = index;
      }
    });
    return best;
  }

  private emit(name: 'profile-preview' | 'profile-commit', bar: BarFile, at: number): void {
    this.dispatchEvent(new CustomEvent<ProfileChangeDetail>(name, { detail: { bar, at }, bubbles: true, composed: true }));
  }

  private onPointerDown(event: PointerEvent): void {
    const bar = this.bar;
    if (!this.editable || !bar?.profile_mm || bar.section.shape !== 'rect') return;
    const point = this.toDrawing(event);
    if (!point) return;
    this.dragIndex = this.nearestStation(bar, point.x);
    if (this.dragIndex < 0) return;
    this.selected = this.dragIndex;
    this.dragStart = bar;
    this.dragOffset = bar.profile_mm[this.dragIndex]![1] * this.exaggeration(bar) - point.y;
    (event.currentTarget as Element).setPointerCapture(event.pointerId);
    event.preventDefault();
  }

  private onPointerMove(event: PointerEvent): void {
    const start = this.dragStart;
    if (!start || this.dragIndex < 0) return;
    const at = performance.now();
    const point = this.toDrawing(event);
    if (!point) return;
    const thickness = (point.y + this.dragOffset) / this.exaggeration(start);
    this.preview = withSmoothDepthChange(start, this.dragIndex, thickness, this.minThicknessMm, this.spread);
    this.emit('profile-preview', this.preview, at);
  }

  private onPointerUp(): void {
    if (!this.dragStart) return;
    const finished = this.preview;
    this.dragStart = null;
    this.dragIndex = -1;
    if (finished) this.emit('profile-commit', finished, performance.now());
  }

  private onKeyDown(event: KeyboardEvent): void {
    const bar = this.bar;
    if (!this.editable || !bar?.profile_mm) return;
    const count = bar.profile_mm.length;
    const index = this.selected < 0 ? Math.floor(count / 2) : this.selected;
    const step = event.shiftKey ? 1 : 0.1;
    let change = 0;
    switch (event.key) {
      case 'ArrowLeft':
        this.selected = Math.max(0, index - 1);
        break;
      case 'ArrowRight':
        this.selected = Math.min(count - 1, index + 1);
        break;
      case 'Home':
        this.selected = 0;
        break;
      case 'End':
        this.selected = count - 1;
        break;
      case 'ArrowUp':
        change = step;
        break;
      case 'ArrowDown':
        change = -step;
        break;
      case 'PageUp':
        change = 1;
        break;
      case 'PageDown':
        change = -1;
        break;
      default:
        return;
    }
    event.preventDefault();
    if (change !== 0) {
      this.selected = index;
      const at = performance.now();
      const next = withSmoothDepthChange(bar, index, bar.profile_mm[index]![1] + change, this.minThicknessMm, 0);
      this.emit('profile-commit', next, at);
    }
  }

  private renderRect(bar: BarFile & { section: { shape: 'rect' } }) {
    const ex = this.exaggeration(bar);
    const length = bar.length_mm;
    const blank = bar.section.thickness_mm;
    const profile = bar.profile_mm ?? [
      [0, blank],
      [length, blank],
    ];
    const width = length + margin.left + margin.right;
    const font = Math.max(4, length / 42);
    const cut = this.cut && this.cut.max_depth_mm > 0 ? this.cut : null;
    const stripHeight = cut ? Math.max(12, length / 22) : 0;
    const stripScale = cut ? Math.max(1, Math.round(stripHeight / cut.max_depth_mm)) : 1;
    const stripTop = blank * ex + font * 4.6;
    const height = cut ? margin.top + stripTop + stripHeight + font * 2.6 : blank * ex + margin.top + font * 4;
    const bottom = profile.map(([x, t]) => `${x},${t * ex}`).join(' ');
    const woodPath = `0,0 ${length},0 ${[...profile].reverse().map(([x, t]) => `${x},${t * ex}`).join(' ')}`;
    const removedPath = `${profile.map(([x, t]) => `${x},${t * ex}`).join(' ')} ${length},${blank * ex} 0,${blank * ex}`;
    const after = this.cutTo?.profile_mm && this.cutTo.section.shape === 'rect' ? this.cutTo.profile_mm : null;
    const cutPath = after ? `${profile.map(([x, t]) => `${x},${t * ex}`).join(' ')} ${[...after].reverse().map(([x, t]) => `${x},${t * ex}`).join(' ')}` : null;
    const stroke = Math.max(0.25, length / 900);
    const labelled: number[] = [];
    const ticks: number[] = [];
    const tickStep = length > 400 ? 50 : length > 150 ? 25 : 10;
    for (let x = 0; x <= length + 1e-9; x += tickStep) ticks.push(x);
    const selected = this.selected >= 0 && this.selected < profile.length ? profile[this.selected]! : null;
    return html`<svg
        viewBox="0 0 ${width} ${height}"
        class=${this.editable ? 'editable' : ''}
        role=${this.editable ? 'slider' : 'img'}
        tabindex=${this.editable ? '0' : '-1'}
        aria-label=${this.editable ? 'Undercut profile: arrow keys left and right choose a station, up and down change its thickness' : `Side profile of the bar, ${formatMm(length)} mm long`}
        aria-valuemin=${this.editable ? this.minThicknessMm : nothing}
        aria-valuemax=${this.editable ? blank : nothing}
        aria-valuenow=${this.editable && selected ? selected[1] : nothing}
        aria-valuetext=${this.editable && selected ? `station at ${formatMm(selected[0])} mm: ${formatMm(selected[1], 2)} mm thick` : nothing}
        @pointerdown=${this.onPointerDown}
        @pointermove=${this.onPointerMove}
        @pointerup=${this.onPointerUp}
        @pointercancel=${this.onPointerUp}
        @keydown=${this.onKeyDown}
      >
        <defs>
          <pattern id="bw-hatch" width="3" height="3" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="3" height="3" fill="#f2ebdd"></rect>
            <line x1="0" y1="0" x2="0" y2="3" stroke="#8c7a55" stroke-width="0.8"></line>
          </pattern>
        </defs>
        <g transform="translate(${margin.left} ${margin.top})">
          ${ticks.map((x) => svg`<line class="ruler" x1=${x} y1=${-4} x2=${x} y2=${-1} stroke-width=${stroke}></line>${x > 0 ? svg`<text x=${x} y=${-5.5} font-size=${font * 0.9} text-anchor="middle">${x}</text>` : nothing}`)}
          <text x="0" y=${-5.5} font-size=${font * 0.9} text-anchor="start">mm</text>
          <polygon class="removed" points=${removedPath}></polygon>
          <polygon class="wood" points=${woodPath} stroke-width=${stroke}></polygon>
          ${cutPath ? svg`<polygon class="to-cut" points=${cutPath} stroke-width=${stroke}></polygon>` : nothing}
          <polyline points=${bottom} fill="none" stroke="var(--bw-wood-edge)" stroke-width=${stroke * 1.5}></polyline>
          ${this.nodesMm.map(
            (x) => svg`<line class="node-line" x1=${x} y1=${-1} x2=${x} y2=${blank * ex + 2} stroke-width=${stroke}></line>
              <circle class="node-mark" cx=${x} cy=${blank * ex * 0.25} r=${font * 0.5} stroke-width=${stroke * 1.5}></circle>`,
          )}
          ${profile.map(([x, t], index) => {
            const isSelected = index === this.selected;
            // Label stations far enough apart to read (and always the selected one).
            const label = isSelected || (labelled.length === 0 || x - labelled[labelled.length - 1]! >= font * 2.3 ? (labelled.push(x), true) : false);
            return svg`${this.editable || bar.profile_mm ? svg`<circle class="station ${isSelected ? 'selected' : ''}" cx=${x} cy=${t * ex} r=${isSelected ? font * 0.55 : font * 0.35} stroke-width=${stroke}></circle>` : nothing}
              ${label && bar.profile_mm ? svg`<text x=${x} y=${blank * ex + font * 1.5} font-size=${font * 0.85} text-anchor="middle">${formatMm(t)}</text>` : nothing}`;
          })}
          <text x="0" y=${blank * ex + font * 3.2} font-size=${font * 0.9}>Height drawn ×${ex} · numbers below: thickness in mm${this.nodesMm.length ? ' · ○ cord holes' : ''}</text>
          ${cut
            ? svg`<g data-testid="cut-strip">
                <line x1="0" y1=${stripTop} x2=${length} y2=${stripTop} stroke="var(--bw-ink-muted)" stroke-width=${stroke}></line>
                ${cut.regions_mm.map(([from, to]) => svg`<rect x=${from} y=${stripTop} width=${Math.max(stroke, to - from)} height=${stroke * 2} fill="var(--bw-cut)"></rect>`)}
                <polygon class="to-cut" stroke-width=${stroke} points=${`${cut.stations[0]?.position_mm ?? 0},${stripTop} ${cut.stations.map((station) => `${station.position_mm},${stripTop + station.remove_mm * stripScale}`).join(' ')} ${cut.stations.at(-1)?.position_mm ?? 0},${stripTop}`}></polygon>
                <text x="0" y=${stripTop + stripHeight + font * 1.4} font-size=${font * 0.9}>Wood to take off, drawn ×${stripScale} (deepest ${formatMm(cut.max_depth_mm, 2)} mm)</text>
              </g>`
            : nothing}
        </g>
      </svg>
      ${selected && this.editable ? html`<p class="caption" aria-live="polite">Station at ${formatMm(selected[0])} mm: <strong>${formatMm(selected[1], 2)} mm</strong> thick</p>` : nothing}`;
  }

  private renderRound(bar: BarFile) {
    const diameter = bar.section.shape === 'tube' ? bar.section.outer_diameter_mm : bar.section.shape === 'round' ? bar.section.diameter_mm : 0;
    const ex = this.exaggeration(bar);
    const length = bar.length_mm;
    const width = length + margin.left + margin.right;
    const height = diameter * ex + margin.top + margin.bottom;
    const font = Math.max(4, length / 42);
    const stroke = Math.max(0.25, length / 900);
    return html`<svg viewBox="0 0 ${width} ${height}" role="img" aria-label="Side view of the ${bar.section.shape}, ${formatMm(length)} mm long">
      <g transform="translate(${margin.left} ${margin.top})">
        <rect class="wood" x="0" y="0" width=${length} height=${diameter * ex} stroke-width=${stroke} style="fill:#c9ccd1;stroke:#4a4f57"></rect>
        ${this.nodesMm.map(
          (x) => svg`<line class="node-line" x1=${x} y1=${-2} x2=${x} y2=${diameter * ex + 2} stroke-width=${stroke}></line>
          <circle class="node-mark" cx=${x} cy=${diameter * ex * 0.5} r=${font * 0.5} stroke-width=${stroke * 1.5}></circle>
          <text x=${x} y=${-4} font-size=${font * 0.85} text-anchor="middle">${formatMm(x)}</text>`,
        )}
        <text x="0" y=${diameter * ex + font * 2} font-size=${font * 0.9}>${formatMm(length)} mm long · height drawn ×${ex}${this.nodesMm.length ? ' · ○ nodes (hang or support here)' : ''}</text>
      </g>
    </svg>`;
  }

  protected override render() {
    const bar = this.shown;
    if (!bar) return html`<p class="muted">No bar selected.</p>`;
    return bar.section.shape === 'rect' ? this.renderRect(bar as BarFile & { section: { shape: 'rect' } }) : this.renderRound(bar);
  }
}

declare global {
  interface HTMLElementTagNameMap {
    'bw-profile-drawing': BwProfileDrawing;
  }
}
