import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { scaleLinear } from 'd3-scale';

import { formatEngineering } from '@rampart/collab/doc/engineering-notation';

import type { PresencePeer } from '../../shared/plan-session/plan-session';

const WIDTH = 1000;
const HEIGHT = 64;
const PAD = 24;

/**
 * The shared time axis: ticks from 0 to `duration`, and everyone's cursor time as a labelled
 * line. Moving the pointer over it reports the time under it (the page throttles and
 * publishes it).
 */
@Component({
  selector: 'rp-time-axis-strip',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg
      [attr.viewBox]="'0 0 ' + width + ' ' + height"
      preserveAspectRatio="none"
      role="img"
      aria-label="Shared time axis with everyone's cursor"
      data-testid="time-axis"
      (pointermove)="move($event)"
      (pointerleave)="cursorTime.emit(null)"
    >
      <line class="axis" [attr.x1]="pad" [attr.x2]="width - pad" y1="40" y2="40" />
      @for (t of ticks(); track t.x) {
        <line class="tick" [attr.x1]="t.x" [attr.x2]="t.x" y1="36" y2="44" />
        <text class="tick-label" [attr.x]="t.x" y="58">{{ t.label }}</text>
      }
      @for (c of cursors(); track c.clientId) {
        <g [attr.data-cursor]="c.userId" [attr.transform]="'translate(' + c.x + ',0)'">
          <line class="cursor" y1="4" y2="44" [attr.stroke]="c.colour" />
          <rect x="3" y="4" width="30" height="16" rx="4" [attr.fill]="c.colour" />
          <text class="cursor-label" x="18" y="16" [attr.fill]="c.ink">{{ c.initials }}</text>
        </g>
      }
    </svg>
    <p class="readout" aria-live="off">
      @for (c of cursors(); track c.clientId) {
        <span [attr.data-cursor-readout]="c.userId">{{ c.name }}: {{ c.time }}</span>
      }
    </p>
  `,
  styles: `
    :host {
      display: block;
    }
    svg {
      width: 100%;
      height: 64px;
      display: block;
      cursor: crosshair;
      background: var(--mat-sys-surface-container-low);
      border-radius: 8px;
      touch-action: none;
    }
    .axis,
    .tick {
      stroke: var(--mat-sys-outline);
    }
    .tick-label {
      fill: var(--mat-sys-on-surface-variant);
      font-size: 12px;
      text-anchor: middle;
    }
    .cursor {
      stroke-width: 2;
    }
    .cursor-label {
      font-size: 11px;
      text-anchor: middle;
    }
    .readout {
      display: flex;
      gap: 16px;
      margin: 4px 0 0;
      min-height: 1.4em;
      font: var(--mat-sys-body-small);
      color: var(--mat-sys-on-surface-variant);
    }
  `,
})
export class TimeAxisStrip {
  /** Span of the axis, seconds. */
  readonly duration = input.required<number>();
  readonly peers = input.required<readonly PresencePeer[]>();
  /** Time under the pointer (s), or null when it leaves the strip. */
  readonly cursorTime = output<number | null>();

  protected readonly width = WIDTH;
  protected readonly height = HEIGHT;
  protected readonly pad = PAD;

  private readonly _scale = computed(() =>
    scaleLinear()
      .domain([0, this.duration() > 0 ? this.duration() : 1])
      .range([PAD, WIDTH - PAD])
      .clamp(true),
  );

  protected readonly ticks = computed(() => {
    const s = this._scale();
    return s.ticks(8).map((t) => ({ x: s(t), label: formatEngineering(t, 's') }));
  });

  protected readonly cursors = computed(() => {
    const s = this._scale();
    return this.peers()
      .filter((p) => p.cursorTime !== null)
      .map((p) => ({
        clientId: p.clientId,
        userId: p.userId,
        name: p.isSelf ? `${p.name} (you)` : p.name,
        initials: p.initials,
        colour: p.colour,
        ink: p.ink,
        x: s(p.cursorTime as number),
        time: formatEngineering(p.cursorTime as number, 's'),
      }));
  });

  protected move(event: PointerEvent): void {
    const svg = event.currentTarget as SVGSVGElement;
    const box = svg.getBoundingClientRect();
    if (box.width === 0) return;
    const x = ((event.clientX - box.left) / box.width) * WIDTH;
    this.cursorTime.emit(this._scale().invert(x));
  }
}
