import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { sheetSections } from '@shared/shop/sheet-text';
import type { WindingSheet } from '@shared/shop/sheet';
import { WindingDrawingView } from './winding-drawing-view';

/**
 * The winding sheet as a page, from the same labelled lines as the PDF, so both say the same thing.
 * Prints as plain black on white A4.
 */
@Component({
  selector: 'gw-winding-sheet-view',
  imports: [WindingDrawingView],
  template: `
    <article class="gw-sheet" aria-labelledby="gw-sheet-title">
      <header class="gw-sheet-header">
        <h2 id="gw-sheet-title">Winding sheet — {{ sheet().header.designNumber }} rev {{ sheet().header.revision }}</h2>
        <dl class="gw-sheet-facts">
          <div>
            <dt>Design</dt>
            <dd>{{ sheet().header.designNumber }}</dd>
          </div>
          <div>
            <dt>Revision</dt>
            <dd>{{ sheet().header.revision }}</dd>
          </div>
          <div>
            <dt>Build order</dt>
            <dd>{{ sheet().header.orderNumber }}</dd>
          </div>
          <div>
            <dt>Quantity</dt>
            <dd>{{ sheet().header.quantity }}</dd>
          </div>
        </dl>
      </header>
      <aside class="gw-sheet-caution" role="note" aria-label="Caution"><strong>Caution.</strong> {{ sheet().caution }}</aside>
      @for (section of sections(); track section.title) {
        <section class="gw-sheet-section">
          <h3>{{ section.title }}</h3>
          <table class="gw-sheet-lines">
            <caption class="gw-visually-hidden">
              {{
                section.title
              }}
            </caption>
            <tbody>
              @for (line of section.lines; track $index) {
                <tr>
                  @if (line[0]) {
                    <th scope="row">{{ line[0] }}</th>
                  } @else {
                    <td class="gw-sheet-nolabel"></td>
                  }
                  <td>{{ line[1] }}</td>
                </tr>
              }
            </tbody>
          </table>
        </section>
        @if (section.title === 'Winding' && sheet().drawing; as drawing) {
          <section class="gw-sheet-section">
            <h3>Winding drawing</h3>
            <gw-winding-drawing [source]="drawing" />
          </section>
        }
      }
      <footer class="gw-sheet-footer">Engine {{ sheet().header.engineVersion }} · frozen at release, never recomputed.</footer>
    </article>
  `,
  styles: `
    .gw-sheet {
      max-width: 190mm;
      padding: 16px 20px;
      border: 1px solid var(--mat-sys-outline-variant);
      background: var(--mat-sys-surface);
    }
    h2 {
      font: var(--mat-sys-title-large);
      margin: 0 0 8px;
    }
    h3 {
      font: var(--mat-sys-title-small);
      margin: 14px 0 4px;
      border-bottom: 1px solid var(--mat-sys-outline-variant);
    }
    .gw-sheet-facts {
      display: flex;
      flex-wrap: wrap;
      gap: 4px 24px;
      margin: 0;
    }
    .gw-sheet-facts div {
      display: flex;
      gap: 6px;
    }
    dt {
      font-weight: 600;
    }
    dd {
      margin: 0;
    }
    .gw-sheet-caution {
      margin-block: 12px;
      padding: 8px 12px;
      border: 2px solid currentColor;
    }
    .gw-sheet-lines {
      border-collapse: collapse;
      width: 100%;
    }
    .gw-sheet-lines th,
    .gw-sheet-lines td {
      text-align: start;
      vertical-align: top;
      padding: 2px 8px 2px 0;
    }
    .gw-sheet-lines th,
    .gw-sheet-nolabel {
      width: 30%;
      font-weight: 600;
    }
    .gw-sheet-footer {
      margin-top: 12px;
      font: var(--mat-sys-body-small);
    }
    @media print {
      @page {
        size: A4;
      }
      .gw-sheet {
        max-width: none;
        padding: 0;
        border: 0;
        background: #fff;
        color: #000;
        font-size: 10.5pt;
      }
      h2,
      h3 {
        color: #000;
      }
      h3 {
        border-bottom-color: #000;
      }
      .gw-sheet-section {
        break-inside: avoid;
      }
      .gw-sheet-caution {
        border-color: #000;
      }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class WindingSheetView {
  readonly sheet = input.required<WindingSheet>();
  protected readonly sections = computed(() => sheetSections(this.sheet()));
}
