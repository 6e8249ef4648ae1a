import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import type { BuildOrder } from '@shared/schemas/shop';
import type { WindingSheet } from '@shared/shop/sheet';
import { afterEach, describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { OrderPage } from './order-page';

// An invented order; only the figures the page shows matter here.
const sheet: WindingSheet = {
  header: {
    designNumber: 'D-0001',
    title: 'Test choke',
    revision: 1,
    orderNumber: 'BO-0001',
    quantity: 2,
    releasedAt: '2026-01-05T10:00:00.000Z',
    author: 'Author',
    approver: 'Approver',
    engineVersion: '1.1.0',
  },
  parts: {
    coreSet: 'Ring core R 25',
    coreMaterial: 'Powder 60',
    gap: { kind: 'none (distributed gap)', total: 0, groundDepth: 0, spacer: 0, spacerAlternative: 0, sensitivity10um: 0, note: 'No gap' },
    bobbin: 'No bobbin',
    wire: {
      description: 'Enamelled round copper 0.8 mm',
      kind: 'metric',
      strandDiameter: 0.8e-3,
      strands: 1,
      overallDiameter: 0.86e-3,
      grade: 1,
      length: 2.5,
      mass: 0.011,
    },
    tapes: [],
  },
  winding: {
    startPin: 'S',
    finishPin: 'F',
    turns: 40,
    layers: 1,
    turnsPerLayer: 40,
    lastLayerTurns: 40,
    direction: 'Clockwise',
    traverse: 'Progressive',
    interlayerTape: 'None',
    margins: 'None',
    outerWrap: 'Two wraps',
  },
  terminations: [],
  assembly: [],
  impregnation: 'None',
  tests: {
    inductance: { nominal: 100e-6, min: 90e-6, max: 110e-6, testFrequency: 10e3, testLevel: 0.25 },
    resistanceMax20: 0.05,
    hipot: { required: false, instruction: 'Not required' },
  },
  marking: 'D-0001 rev 1',
  predicted: { inductanceNominal: 100e-6, resistance20: 0.045, totalLoss: 1.2, hotSpot: 70, peakFlux: 0.3, saturationAtHotSpot: 1.2 },
  caution: 'Engineering estimate.',
};

const order = (change: Partial<BuildOrder>): BuildOrder => ({
  id: 7,
  number: 'BO-0001',
  revisionId: 3,
  quantity: 2,
  status: 'open',
  createdBy: 2,
  createdAt: '2026-01-05T10:00:00.000Z',
  completedAt: null,
  sheet,
  units: [
    {
      id: 1,
      orderId: 7,
      unitNumber: 1,
      inductance: 98.5e-6,
      testFrequency: 10e3,
      resistance: 41e-3,
      resistanceTemperature: 23,
      resistanceAt20: 40.5e-3,
      hipot: 'not_tested',
      passed: true,
      findings: [],
      notes: null,
      recordedBy: 4,
      recordedAt: '2026-01-06T10:00:00.000Z',
      biasCurrent: null,
      biasInductance: null,
      voidedAt: null,
      voidedBy: null,
      voidReason: null,
      canVoid: false,
    },
  ],
  canRecord: false,
  ...change,
});

describe('OrderPage', () => {
  let fixture: ComponentFixture<OrderPage>;
  let http: HttpTestingController;
  let page: HTMLElement;

  afterEach(() => http.verify());

  async function open(answer: BuildOrder): Promise<void> {
    ({ fixture, http, page } = await renderWithHttpTesting(OrderPage, { id: '7' }, { settle: false }));
    http.expectOne('/api/shop/orders/7').flush(answer);
    await fixture.whenStable();
  }

  it('shows the record form when the server says this user may record a unit', async () => {
    await open(order({ canRecord: true }));
    expect(page.querySelector('gw-record-unit-form')).not.toBeNull();
  });

  it('shows no record form when the server says no, whatever the order state', async () => {
    await open(order({ canRecord: false }));
    expect(page.querySelector('gw-record-unit-form')).toBeNull();
    expect(page.querySelector('[role="status"]')).toBeNull();
  });

  it('shows each unit’s readings in engineering units (98.5 µH, 41 mΩ referred to 40.5 mΩ at 20 °C)', async () => {
    await open(order({ status: 'complete', completedAt: '2026-01-07T10:00:00.000Z' }));
    const row = page.querySelector('tr.mat-mdc-row')!.textContent!.replace(/\s+/g, ' ');
    expect(row).toContain('98.5 µH at 10 kHz');
    expect(row).toContain('41 mΩ at 23 °C (40.5 mΩ)');
    expect(page.querySelector('[role="status"]')?.textContent).toMatch(/complete: 1 units passed/);
  });

  it('strikes a voided record through with its reason, counts it for nothing, and offers its number to record again', async () => {
    const first = order({}).units[0];
    const voided = { ...first, voidedAt: '2026-01-06T11:00:00.000Z', voidedBy: 4, voidReason: 'read at 100 kHz' };
    await open(order({ canRecord: true, units: [voided, { ...first, id: 2, unitNumber: 2, canVoid: true }] }));
    const rows = [...page.querySelectorAll('tr.mat-mdc-row')];
    expect(rows[0].classList).toContain('gw-voided');
    expect(rows[0].textContent).toMatch(/voided.*Voided .*: read at 100 kHz/s);
    expect(rows[0].querySelector('button')).toBeNull();
    expect(rows[1].querySelector('button')?.getAttribute('aria-label')).toBe('Void the record of unit 2');
    expect(page.textContent).toMatch(/1 passed of 1 built/);
    const again = [...page.querySelectorAll('.gw-record-again button')].map((b) => b.textContent?.trim());
    expect(again).toEqual(['Unit 1']);
  });
});
