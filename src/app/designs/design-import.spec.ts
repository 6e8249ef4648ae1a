import type { HttpTestingController } from '@angular/common/http/testing';
import type { ComponentFixture } from '@angular/core/testing';
import { TestBed } from '@angular/core/testing';
import { Router } from '@angular/router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';

import { designDetail } from '../testing/designs';
import { renderWithHttpTesting } from '../testing/render';
import { DesignImport } from './design-import';

// An invented design file as the export writes it (extra fields such as the result are ignored on import).
const FILE = {
  format: 'gapwright-design',
  formatVersion: 1,
  title: 'Sample rail',
  number: 'GW-0042',
  spec: { converter: { vinMin: 36, vinMax: 60, vout: 12, ioutMax: 10, frequency: 200e3, rippleRatio: 0.3, rectifier: 'synchronous' } },
  construction: { coreId: 'ETD34/17/11', materialId: '1', turns: 14, gap: 'auto', wire: { kind: 'awg', awg: 16, strands: 2 } },
  result: { ignored: true },
};

describe('DesignImport', () => {
  let fixture: ComponentFixture<DesignImport>;
  let http: HttpTestingController;
  let page: HTMLElement;

  beforeEach(async () => {
    ({ fixture, http, page } = await renderWithHttpTesting(DesignImport, {}));
  });

  afterEach(() => http.verify());

  async function choose(text: string, name = 'design.json'): Promise<void> {
    const input = page.querySelector<HTMLInputElement>('input[type="file"]')!;
    Object.defineProperty(input, 'files', { value: [new File([text], name, { type: 'application/json' })], configurable: true });
    input.dispatchEvent(new Event('change'));
    await new Promise((resolve) => setTimeout(resolve, 20));
    await fixture.whenStable();
  }

  const button = (text: string) => [...page.querySelectorAll('button')].find((b) => b.textContent?.trim() === text)!;

  it('previews a design file, imports it as a new design and opens it', async () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate').mockResolvedValue(true);
    await choose(JSON.stringify(FILE));
    const preview = page.querySelector('.gw-preview')!.textContent!.replace(/\s+/g, ' ');
    expect(preview).toContain('Sample rail from design.json');
    expect(preview).toContain('36 V–60 V → 12 V, 10 A at 200 kHz, synchronous rectifier');
    expect(preview).toContain('Construction: core ETD34/17/11, 14 turns');

    button('Import as a new design').click();
    const request = http.expectOne('/api/designs/import');
    expect(request.request.body).toMatchObject({ title: 'Sample rail', construction: { turns: 14 } });
    request.flush(designDetail({ id: 43 }), { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith(['/designs', 43]);
  });

  it('says a file is not JSON, and names each field a wrong file gets wrong, sending nothing', async () => {
    await choose('{ "format": ', 'broken.json');
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('broken.json is not JSON');

    await choose(
      JSON.stringify({ ...FILE, formatVersion: 2, spec: { converter: { ...FILE.spec.converter, vout: 'twelve' } } }),
      'old.json',
    );
    const alert = page.querySelector('[role="alert"]')!.textContent!;
    expect(alert).toContain('old.json is not a Gapwright design file this version reads');
    expect(alert).toContain('formatVersion: formatVersion must be 1');
    expect(alert).toContain('spec.converter.vout');
    expect(page.querySelector('.gw-preview')).toBeNull();
  });

  it('shows the server’s refusal by field beside the file', async () => {
    await choose(JSON.stringify(FILE));
    button('Import as a new design').click();
    http
      .expectOne('/api/designs/import')
      .flush(
        { error: { code: 'validation', message: 'The design file cannot be imported', fields: { 'construction.coreId': 'Unknown core' } } },
        { status: 400, statusText: 'Bad Request' },
      );
    await fixture.whenStable();
    expect(page.querySelector('[role="alert"]')?.textContent).toContain('construction.coreId: Unknown core');
  });
});
