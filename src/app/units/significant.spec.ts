import { describe, expect, it } from 'vitest';

import { SignificantPipe } from './significant';

describe('SignificantPipe', () => {
  const pipe = new SignificantPipe();

  it('keeps the stated significant digits and drops trailing zeros', () => {
    expect(pipe.transform(1.3999752205857978, 4)).toBe('1.4');
    expect(pipe.transform(0.0012234, 4)).toBe('0.001223');
    expect(pipe.transform(3.201056461435749, 5)).toBe('3.2011');
    expect(pipe.transform(2.65)).toBe('2.65');
  });

  it('shows a dash for a missing value', () => {
    expect(pipe.transform(null)).toBe('—');
    expect(pipe.transform(Number.NaN)).toBe('—');
  });
});
