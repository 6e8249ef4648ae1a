import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection, signal } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import type { Role } from '@shared/schemas/auth';
import type { CircuitCorner, RevisionCheck, RevisionChecks } from '@shared/schemas/checks';
import { provideEchartsCore } from 'ngx-echarts';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';

import { Session } from '../core/session';
import { ChecksPanel, POLL_MS } from './checks-panel';

// Invented figures: the panel shows what the server stored, it computes nothing itself.
const corner: CircuitCorner = {
  id: 'vin-max',
  label: 'Vin max 36 V, 10 A',
  vin: 36,
  load: 10,
  duty: 1 / 3,
  predictedInductance: 26e-6,
  simulated: { ripple: 3.05, peak: 11.52, average: 10.01, valley: 8.47 },
  predicted: { ripple: 3.0, peak: 11.5, average: 10, valley: 8.5 },
  differencePercent: { ripple: 5 / 3, peak: 0.174, average: 0.1 },
  drift: 0,
  waveform: {
    simulated: [
      [0, 8.47],
      [3.33e-6, 11.52],
      [1e-5, 8.47],
    ],
    predicted: [
      [0, 8.5],
      [3.33e-6, 11.5],
      [1e-5, 8.5],
    ],
  },
};

function check(status: RevisionCheck['status'], extra: Partial<RevisionCheck> = {}): RevisionCheck {
  return {
    id: 5,
    revisionId: 9,
    kind: 'circuit',
    status,
    progress: status === 'running' ? 0.5 : 0,
    result: null,
    failure: null,
    requestedBy: 'Sample engineer',
    createdAt: '2026-01-01T00:00:00.000Z',
    startedAt: null,
    finishedAt: null,
    ...extra,
  };
}

const LIST = '/api/designs/3/revisions/2/checks';

describe('ChecksPanel', () => {
  let fixture: ComponentFixture<ChecksPanel>;
  let http: HttpTestingController;
  const role = signal<Role | null>('engineer');

  beforeEach(() => {
    role.set('engineer');
    TestBed.configureTestingModule({
      providers: [
        provideZonelessChangeDetection(),
        provideHttpClient(),
        provideHttpClientTesting(),
        provideEchartsCore({ echarts: () => new Promise<never>(() => undefined) }),
        // The chart theme follows the theme switcher, which reads the signed-in user's preference.
        { provide: Session, useValue: { role, user: signal(null) } },
      ],
    });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());
  const pause = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

  async function render(answer: RevisionChecks): Promise<HTMLElement> {
    fixture = TestBed.createComponent(ChecksPanel);
    fixture.componentRef.setInput('designId', 3);
    fixture.componentRef.setInput('revision', 2);
    await fixture.whenStable();
    http.expectOne(LIST).flush(answer);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }
  const text = (page: HTMLElement) => page.textContent?.replace(/\s+/g, ' ') ?? '';
  const button = (page: HTMLElement, label: string) =>
    [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === label) as HTMLButtonElement | undefined;

  it('shows a finished check: caution line, one chart and a table per corner with the differences in %', async () => {
    const page = await render({
      checks: [
        check('done', {
          progress: 1,
          result: {
            kind: 'circuit',
            inductorModel: 'constant',
            nominalInductance: 26e-6,
            windingResistance: 0.02,
            notes: ['A note.'],
            corners: [corner],
            exportedModel: {
              vin: 36,
              load: 10,
              inductance: 27e-6,
              simulated: { ripple: 2.98, peak: 11.48, average: 9.98, dissipation: 1.156 },
              predicted: { ripple: 2.99, peak: 11.49, average: 10, loss: 1.155 },
              differencePercent: { ripple: -0.33, peak: -0.09, dissipation: 0.09 },
              drift: 0,
            },
          },
        }),
      ],
      canRun: true,
      frozenReason: null,
    });
    expect(text(page)).toContain(
      "Circuit simulation of the power stage with the design's inductor model, and a 2D field solution of the core, gap and winding; engineering estimates — qualified review required.",
    );
    expect(page.querySelectorAll('[data-corner="vin-max"] .gw-checks-chart')).toHaveLength(1);
    const rows = [...page.querySelectorAll('[data-corner="vin-max"] tbody tr')].map((r) =>
      [...r.children].map((cell) => cell.textContent?.trim()).join(' '),
    );
    expect(rows).toEqual(['Ripple (p-p) 3.050 3.000 +1.67 %', 'Peak 11.520 11.500 +0.17 %', 'Average 10.010 10.000 +0.10 %']);
    const exported = [...page.querySelectorAll('[data-corner="exported-model"] tbody tr')].map((r) =>
      [...r.children].map((cell) => cell.textContent?.trim()).join(' '),
    );
    expect(exported).toEqual([
      'Ripple (p-p), A 2.980 2.990 -0.33 %',
      'Peak, A 11.480 11.490 -0.09 %',
      'Dissipated / total loss, W 1.156 1.155 +0.09 %',
    ]);
    expect(text(page)).toContain('The exported SPICE subcircuit in the same bench at Vin 36 V, 10 A (its L1 27.00 µH)');
    expect(button(page, 'Run the circuit check')).toBeDefined();
  });

  it('queues a check on request and reads the list again', async () => {
    const page = await render({ checks: [], canRun: true, frozenReason: null });
    expect(text(page)).toContain('No check has been run on this revision yet.');
    button(page, 'Run the circuit check')!.click();
    const post = http.expectOne({ method: 'POST', url: LIST });
    expect(post.request.body).toEqual({ kind: 'circuit' });
    post.flush(check('queued'), { status: 202, statusText: 'Accepted' });
    await fixture.whenStable();
    http.expectOne(LIST).flush({ checks: [check('queued')], canRun: true, frozenReason: null });
    await fixture.whenStable();
    expect(text(page)).toContain('Circuit check queued');
    fixture.destroy();
  });

  it('follows a running check every 2 s with a progress bar, and cancels it', async () => {
    const page = await render({ checks: [check('running')], canRun: true, frozenReason: null });
    expect(text(page)).toContain('Circuit check running: 50 %');
    expect(page.querySelector('mat-progress-bar')).not.toBeNull();
    expect(button(page, 'Run the circuit check')).toBeUndefined();
    await pause(POLL_MS + 100);
    http.expectOne(LIST).flush({ checks: [check('running', { progress: 0.75 })], canRun: true, frozenReason: null });
    await fixture.whenStable();
    expect(text(page)).toContain('75 %');
    button(page, 'Cancel the circuit check')!.click();
    http.expectOne({ method: 'POST', url: `${LIST}/5/cancel` }).flush(check('cancelled'));
    await fixture.whenStable();
    http.expectOne(LIST).flush({ checks: [check('cancelled')], canRun: true, frozenReason: null });
    await fixture.whenStable();
    expect(text(page)).toContain('Circuit check cancelled.');
    await pause(POLL_MS + 100);
    http.expectNone(LIST);
  }, 15_000);

  it('gives a failure’s reason, and offers nothing to run on a released revision', async () => {
    const page = await render({
      checks: [check('failed', { failure: 'The circuit simulator failed: ngspice is not installed' })],
      canRun: false,
      frozenReason: 'Revision 2 of GW-0003 is released: its checks are frozen with it.',
    });
    expect(text(page)).toContain('Circuit check failed: The circuit simulator failed: ngspice is not installed');
    expect(text(page)).toContain('is released: its checks are frozen');
    expect(page.querySelectorAll('button')).toHaveLength(0);
  });

  it('shows a finished field check: engine beside field with the difference, and the picture as an image', async () => {
    const page = await render({
      checks: [
        check('done', {
          kind: 'field',
          result: {
            kind: 'field',
            model: 'planar',
            depth: 5.288e-3,
            inductance: { engine: 40e-6, field: 41e-6, difference: 0.025 },
            peakFlux: { engine: 0.25, field: 0.26, difference: 0.04 },
            peakFluxLocal: 0.7,
            acResistance: [{ harmonic: 1, frequency: 100e3, engine: 0.05, field: 0.15, difference: 2, fieldLayers: [0.1, 0.05] }],
            dcResistance: 0.02,
            nodes: 30000,
            seconds: 12.5,
            notes: ['A field note.'],
            picture: '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"></svg>',
          },
        }),
      ],
      canRun: true,
      frozenReason: null,
    });
    expect(text(page)).toContain('Field check done');
    const rows = [...page.querySelectorAll('gw-field-check-view tbody tr')].map((r) =>
      [...r.children].map((cell) => cell.textContent?.trim()).join(' | '),
    );
    expect(rows).toEqual([
      'Inductance, nominal | 40 µH | 41 µH | +2.5 %',
      'Peak flux density (centre-leg mean) | 250 mT | 260 mT | +4.0 %',
      'AC resistance at 100 kHz | 50 mΩ | 150 mΩ | +200.0 %',
      'Largest |B| at the gap’s corners | — | 700 mT | —',
    ]);
    expect(page.querySelector('gw-field-check-view img')?.getAttribute('src')).toMatch(/^data:image\/svg\+xml;charset=utf-8,%3Csvg/);
    expect(text(page)).toContain('A field note.');
    expect(page.querySelector('[data-testid="field-model"]')?.textContent).toContain('Planar model, depth 5.29 mm');
    expect(button(page, 'Run the field check')).toBeDefined();
  });

  it('offers no run button to a winder', async () => {
    role.set('winder');
    const page = await render({ checks: [], canRun: true, frozenReason: null });
    expect(button(page, 'Run the circuit check')).toBeUndefined();
  });
});
