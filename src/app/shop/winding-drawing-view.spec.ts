import type { WindingDrawingInput } from '@shared/shop/winding-drawing';
import { describe, expect, it } from 'vitest';

import { renderWithHttpTesting } from '../testing/render';
import { WindingDrawingView } from './winding-drawing-view';

// An invented winding: 10 turns, two 0.5 mm wires in hand (0.55 mm over enamel), 6 turns a layer, on a window of
// 8 × 24 mm with a 0.4 mm ground gap and a 0.8 mm keep-out.
const mm = 1e-3;
const source: WindingDrawingInput = {
  family: 'ETD',
  turns: 10,
  layers: 2,
  turnsPerLayer: 6,
  wire: { kind: 'metric', strandDiameter: 0.5 * mm, overallDiameter: 0.55 * mm, conductorsPerTurn: 2 },
  keepOut: 0.8 * mm,
  gap: { placement: 'ground', total: 0.4 * mm, spacer: 0.18 * mm },
  core: {
    windowWidth: 8 * mm,
    windowHeight: 24 * mm,
    bobbinWidth: 21 * mm,
    bobbinHeight: 6 * mm,
    centreLeg: 11 * mm,
    outerLeg: 5 * mm,
    yoke: 5 * mm,
    ring: null,
  },
};

describe('WindingDrawingView', () => {
  it('draws every wire of every turn as a circle in an SVG named for what it shows, with dimensions in mm', async () => {
    const { page } = await renderWithHttpTesting(WindingDrawingView, { source });
    const svg = page.querySelector('svg[role="img"]')!;
    expect(svg.getAttribute('aria-label')).toBe('Winding section through one window, 10 turns');
    expect(svg.querySelectorAll('circle.r-copper')).toHaveLength(20);
    const texts = [...svg.querySelectorAll('text')].map((t) => t.textContent!.trim());
    expect(texts).toEqual(
      expect.arrayContaining([
        'keep-out 0.8 mm',
        'build 1.1 mm',
        'winding width 21 mm',
        'gap 0.4 mm (centre leg)',
        'bobbin build height 6 mm',
      ]),
    );
    // one gap (the centre leg's), hatching over the keep-out, the theme's colours through classes
    expect(svg.querySelectorAll('rect.r-gap')).toHaveLength(1);
    expect(svg.querySelectorAll('line.l-keep-out').length).toBeGreaterThan(3);
    expect(page.querySelector('figcaption')!.textContent).toContain('10 turns in 2 layers of 6 (4 on the last); 2 in hand');
  });

  it('draws a ring along its axis: the core as a ring, the turns inside and their returns outside', async () => {
    const ring: WindingDrawingInput = {
      ...source,
      family: 'RING',
      layers: 1,
      turnsPerLayer: 60,
      wire: { ...source.wire, conductorsPerTurn: 1 },
      keepOut: null,
      gap: null,
      core: { ...source.core, ring: { od: 26.9 * mm, id: 14.7 * mm, height: 11.2 * mm } },
    };
    const { page } = await renderWithHttpTesting(WindingDrawingView, { source: ring });
    expect(page.querySelectorAll('path.r-core[fill-rule="evenodd"]')).toHaveLength(1);
    expect(page.querySelectorAll('circle.r-copper')).toHaveLength(20);
    expect(page.querySelectorAll('rect.r-gap')).toHaveLength(0);
  });

  it('says so instead of drawing when not one turn fits a layer', async () => {
    const { page } = await renderWithHttpTesting(WindingDrawingView, { source: { ...source, turnsPerLayer: 0 } });
    expect(page.querySelector('svg')).toBeNull();
    expect(page.textContent).toContain('The wire does not fit this core');
  });
});
