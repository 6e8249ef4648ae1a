import { describe, expect, it } from 'vitest';

import { splitByFit } from './loss-chart-options';

const point = (x: number, extrapolated: boolean) => ({ x, steinmetz: x * 2, igse: x * 3, extrapolated });

describe('splitByFit', () => {
  it('draws the fitted part solid and joins the dashed parts at the edges of the fit', () => {
    const { fitted, extrapolated } = splitByFit([point(1, true), point(2, false), point(3, false), point(4, true)], 'igse');
    expect(fitted).toEqual([null, [2, 6], [3, 9], null]);
    expect(extrapolated).toEqual([
      [1, 3],
      [2, 6],
      [3, 9],
      [4, 12],
    ]);
  });

  it('leaves the dashed line empty when every point lies in the fit', () => {
    const { fitted, extrapolated } = splitByFit([point(1, false), point(2, false), point(3, false)], 'steinmetz');
    expect(fitted).toEqual([
      [1, 2],
      [2, 4],
      [3, 6],
    ]);
    expect(extrapolated).toEqual([null, null, null]);
  });
});
