import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { layoutDrawing } from '@shared/shop/drawing-layout';
import { windingDrawing, type WindingDrawingInput } from '@shared/shop/winding-drawing';

/** Box the drawing is fitted into (px); the SVG scales with its container's width. */
const BOX = { width: 640, height: 360, fontSize: 11 };

/**
 * The winding drawn to scale as SVG (shared/shop/winding-drawing.ts, fitted by drawing-layout.ts): the same shapes the
 * sheet's PDF paints, in the theme's colours here (black on white in print).
 */
@Component({
  selector: 'gw-winding-drawing',
  template: `
    <figure class="gw-drawing">
      @if (placed().shapes.length) {
        <svg
          [attr.viewBox]="'0 0 ' + placed().width + ' ' + placed().height"
          role="img"
          [attr.aria-label]="drawing().title"
          [style.font-size.px]="placed().fontSize"
        >
          @for (s of placed().shapes; track $index) {
            @switch (s.kind) {
              @case ('rect') {
                <rect [attr.class]="'r-' + s.role" [attr.x]="s.x" [attr.y]="s.y" [attr.width]="s.width" [attr.height]="s.height" />
              }
              @case ('circle') {
                <circle [attr.class]="'r-' + s.role" [attr.cx]="s.cx" [attr.cy]="s.cy" [attr.r]="s.r" />
              }
              @case ('annulus') {
                <path [attr.class]="'r-' + s.role" fill-rule="evenodd" [attr.d]="annulusPath(s.cx, s.cy, s.r, s.inner)" />
              }
              @case ('line') {
                <line
                  [attr.class]="'l-' + s.role + (s.dashed ? ' dashed' : '') + (s.thin ? ' thin' : '')"
                  [attr.x1]="s.x1"
                  [attr.y1]="s.y1"
                  [attr.x2]="s.x2"
                  [attr.y2]="s.y2"
                />
              }
              @case ('polygon') {
                <polygon [attr.class]="'r-' + s.role" [attr.points]="s.points.join(' ')" />
              }
              @case ('text') {
                <text
                  [attr.x]="s.x"
                  [attr.y]="s.y"
                  [attr.text-anchor]="s.anchor"
                  dominant-baseline="central"
                  [attr.transform]="s.vertical ? 'rotate(-90 ' + s.x + ' ' + s.y + ')' : null"
                >
                  {{ s.text }}
                </text>
              }
            }
          }
        </svg>
      }
      <figcaption>
        @for (note of drawing().notes; track $index) {
          <p>{{ note }}</p>
        }
      </figcaption>
    </figure>
  `,
  styles: `
    .gw-drawing {
      margin: 8px 0;
    }
    svg {
      display: block;
      width: 100%;
      max-width: 640px;
      height: auto;
    }
    text {
      fill: var(--mat-sys-on-surface);
    }
    .r-core {
      fill: var(--mat-sys-surface-container-high);
      stroke: var(--mat-sys-outline);
      stroke-width: 0.6;
    }
    .r-gap {
      fill: var(--mat-sys-error);
    }
    .r-bobbin {
      fill: var(--mat-sys-secondary-container);
      stroke: var(--mat-sys-outline-variant);
      stroke-width: 0.6;
    }
    .r-tape,
    .l-tape {
      fill: var(--mat-sys-tertiary-container);
      stroke: var(--mat-sys-on-surface-variant);
      stroke-width: 0.8;
    }
    .r-copper {
      fill: var(--mat-sys-tertiary);
      stroke: var(--mat-sys-on-surface);
      stroke-width: 0.5;
    }
    .r-insulation {
      fill: var(--mat-sys-surface);
      stroke: var(--mat-sys-outline-variant);
      stroke-width: 0.4;
    }
    .r-keep-out {
      fill: color-mix(in srgb, var(--mat-sys-error) 12%, transparent);
      stroke: var(--mat-sys-error);
      stroke-width: 0.6;
    }
    .l-keep-out {
      stroke: var(--mat-sys-error);
    }
    .l-axis {
      stroke: var(--mat-sys-on-surface);
    }
    .r-dimension {
      fill: var(--mat-sys-on-surface);
    }
    .l-dimension {
      stroke: var(--mat-sys-on-surface);
      stroke-width: 0.8;
    }
    .thin {
      stroke-width: 0.4;
    }
    .dashed {
      stroke-dasharray: 10 3 2 3;
    }
    figcaption {
      font: var(--mat-sys-body-small);
    }
    figcaption p {
      margin: 2px 0;
    }
    @media print {
      text,
      .r-dimension {
        fill: #000;
      }
      .l-dimension,
      .l-axis {
        stroke: #000;
      }
      .r-core {
        fill: #ccc;
        stroke: #555;
      }
      .r-copper {
        fill: #8c8c8c;
        stroke: #222;
      }
      .r-bobbin {
        fill: #eee;
        stroke: #888;
      }
      .r-gap {
        fill: #000;
      }
      .r-keep-out,
      .l-keep-out {
        fill: none;
        stroke: #000;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WindingDrawingView {
  readonly source = input.required<WindingDrawingInput>();
  protected readonly drawing = computed(() => windingDrawing(this.source()));
  protected readonly placed = computed(() => layoutDrawing(this.drawing(), BOX));

  /** A ring: the outer circle and the inner one, filled between them (even-odd). */
  protected annulusPath(cx: number, cy: number, r: number, inner: number): string {
    const circle = (radius: number) =>
      `M ${cx - radius} ${cy} a ${radius} ${radius} 0 1 0 ${2 * radius} 0 a ${radius} ${radius} 0 1 0 ${-2 * radius} 0`;
    return `${circle(r)} ${circle(inner)}`;
  }
}
