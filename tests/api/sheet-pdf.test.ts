import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SHEET_CAUTION } from '@shared/shop/sheet';
import { ApiClient, signedInAs } from './support/api-client.ts';
import { createTestApp, type TestApp } from './support/test-app.ts';

let t: TestApp;
let erin: ApiClient; // engineer, the author
let ruth: ApiClient; // reviewer
let wendell: ApiClient; // winder

beforeAll(async () => {
  t = await createTestApp();
  [erin, ruth, wendell] = await Promise.all([signedInAs(t.app, 'engineer'), signedInAs(t.app, 'reviewer'), signedInAs(t.app, 'winder')]);
});
afterAll(() => t.close());

/** The PDF's text page by page (pdftotext ends each page with a form feed). */
function pagesOf(pdf: Buffer, name: string): string[] {
  const dir = mkdtempSync(path.join(tmpdir(), 'gapwright-pdf-'));
  const file = path.join(dir, 'sheet.pdf');
  writeFileSync(file, pdf);
  // Kept as test artifacts: the PDF and each page as a PNG.
  const results = process.env['TEST_RESULTS_DIR'] ?? path.resolve('test-results');
  mkdirSync(results, { recursive: true });
  writeFileSync(path.join(results, `${name}.pdf`), pdf);
  execFileSync('pdftoppm', ['-png', '-r', '80', file, path.join(results, name)]);
  const text = execFileSync('pdftotext', [file, '-'], { encoding: 'utf8' });
  return text.split('\f').filter((page) => page.trim() !== '');
}

const squeeze = (text: string) => text.replace(/\s+/g, '');

describe('the winding sheet PDF of a released demo design', () => {
  let pages: string[];
  let header: { designNumber: string; revision: number; orderNumber: string };
  let turns: number;

  beforeAll(async () => {
    // The demo engineer's first feasible seeded draft, released as the review flow does.
    const { rows } = await t.pool.query<{ id: number }>(
      `select r.id from design_revisions r
         join designs d on d.id = r.design_id
         join users u on u.id = d.owner_id
        where u.username = 'erin' and r.status = 'draft' and (r.result -> 'evaluation' ->> 'feasible') = 'true'
        order by d.id limit 1`,
    );
    const id = rows[0].id;
    expect((await erin.post(`/api/revisions/${id}/submit`, {})).status).toBe(200);
    expect((await ruth.post(`/api/revisions/${id}/approve`, {})).status).toBe(200);
    const released = await ruth.post(`/api/revisions/${id}/release`, { quantity: 1 });
    expect(released.status).toBe(200);
    const order = (await wendell.get(`/api/shop/orders/${released.body.orderId}`)).body;
    header = order.sheet.header;
    turns = order.sheet.winding.turns;
    expect(order.sheet.drawing.turns).toBe(turns);
    const pdf = await wendell.getBytes(`/api/shop/orders/${released.body.orderId}/sheet.pdf`);
    expect(pdf.status).toBe(200);
    pages = pagesOf(pdf.body as Buffer, 'winding-sheet-demo');
  });

  it('heads every page with the design, its revision and the build order', () => {
    expect(pages.length).toBeGreaterThan(1);
    for (const page of pages) expect(page).toContain(`${header.designNumber} rev ${header.revision} · build order ${header.orderNumber}`);
  });

  it('numbers every page "page n of m" and ends it with the caution in full', () => {
    pages.forEach((page, i) => {
      expect(page).toContain(`page ${i + 1} of ${pages.length}`);
      expect(squeeze(page)).toContain(squeeze(SHEET_CAUTION));
    });
  });

  it('draws the winding with its dimensions in mm and says what it shows', () => {
    const drawing = pages.find((page) => page.includes('Winding drawing'))!;
    expect(drawing).toMatch(/winding width \d+(\.\d+)? mm/);
    expect(drawing).toMatch(/build \d+(\.\d+)? mm/);
    expect(drawing).toMatch(/bobbin build height \d+(\.\d+)? mm/);
    expect(squeeze(drawing)).toContain(squeeze(`${turns} turns in`));
  });

  it('never leaves a page holding a section title alone or a single stray line', () => {
    const titles = ['Order', 'Parts', 'Winding', 'Winding drawing', 'Terminations', 'Assembly', 'Tests and limits', 'Marking'];
    for (const page of pages) {
      // The page's own content: without its header line, page number and the caution of the footer.
      const body = page
        .split('\n')
        .map((line) => line.trim())
        .filter((line) => line !== '' && !line.includes(' · build order ') && !/^page \d+ of \d+$/.test(line))
        .filter((line) => !squeeze(SHEET_CAUTION).includes(squeeze(line)));
      expect(body.length).toBeGreaterThan(2);
      expect(titles).not.toContain(body.at(-1));
    }
  });
});
