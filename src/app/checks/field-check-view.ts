import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { FieldCheckResult } from '@shared/schemas/checks';
import { formatQuantity, type QuantityKind } from '@shared/units/index';

interface Row {
  label: string;
  engine: string;
  field: string;
  difference: string;
}

const percent = (fraction: number) => `${fraction >= 0 ? '+' : ''}${(fraction * 100).toFixed(1)} %`;

/** The field check's figures beside the engine's, its notes, and the flux-line picture drawn by the server. */
@Component({
  selector: 'gw-field-check-view',
  template: `
    <p class="gw-field-model" data-testid="field-model">{{ model() }}</p>
    <ul class="gw-checks-notes">
      @for (note of result().notes; track note) {
        <li>{{ note }}</li>
      }
    </ul>
    <div class="gw-field">
      <table>
        <caption class="gw-visually-hidden">
          Engine figures beside the field solution
        </caption>
        <thead>
          <tr>
            <th scope="col">Figure</th>
            <th scope="col">Engine</th>
            <th scope="col">Field solution</th>
            <th scope="col">Difference</th>
          </tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.label) {
            <tr>
              <th scope="row">{{ row.label }}</th>
              <td>{{ row.engine }}</td>
              <td>{{ row.field }}</td>
              <td>{{ row.difference }}</td>
            </tr>
          }
        </tbody>
      </table>
      <figure>
        <img [src]="picture()" alt="Flux lines of the field solution over the core window, the gap and the winding" />
        <figcaption>
          Flux lines at 1 A, drawn from the solution ({{ result().nodes }} nodes, {{ result().seconds.toFixed(1) }} s).
        </figcaption>
      </figure>
    </div>
  `,
  styleUrl: './field-check-view.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FieldCheckView {
  readonly result = input.required<FieldCheckResult>();

  /** The server's SVG as an image source (an <img> runs no script, whatever the text holds). */
  protected readonly picture = computed(() => `data:image/svg+xml;charset=utf-8,${encodeURIComponent(this.result().picture)}`);

  /** Which 2-D model was solved: the planar one with the depth its per-metre figures were multiplied by. */
  protected readonly model = computed(() => {
    const r = this.result();
    return r.model === 'planar' && r.depth !== undefined
      ? `Planar model, depth ${(r.depth * 1e3).toFixed(r.depth < 10e-3 ? 2 : 1)} mm (a section through both windows; end turns not modelled).`
      : 'Axisymmetric model (the core as a body of revolution).';
  });

  protected readonly rows = computed<Row[]>(() => {
    const r = this.result();
    const row = (label: string, pair: { engine: number; field: number; difference: number }, kind: QuantityKind): Row => ({
      label,
      engine: formatQuantity(pair.engine, kind),
      field: formatQuantity(pair.field, kind),
      difference: percent(pair.difference),
    });
    return [
      row('Inductance, nominal', r.inductance, 'inductance'),
      row('Peak flux density (centre-leg mean)', r.peakFlux, 'fluxDensity'),
      ...r.acResistance.map((h) => row(`AC resistance at ${formatQuantity(h.frequency, 'frequency')}`, h, 'resistance')),
      { label: 'Largest |B| at the gap’s corners', engine: '—', field: formatQuantity(r.peakFluxLocal, 'fluxDensity'), difference: '—' },
    ];
  });
}
