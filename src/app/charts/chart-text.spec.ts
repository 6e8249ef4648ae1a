import { describe, expect, it } from 'vitest';

import { escapeHtml, tooltipLines } from './chart-text';

describe('chart text', () => {
  it('turns every markup character into an entity', () => {
    expect(escapeHtml(`<meta http-equiv="refresh" content='0;url=/x'> & more`)).toBe(
      '&lt;meta http-equiv=&quot;refresh&quot; content=&#39;0;url=/x&#39;&gt; &amp; more',
    );
  });

  it('escapes each line and joins the lines with breaks', () => {
    expect(tooltipLines('<b>bold</b>', '1.000 W')).toBe('&lt;b&gt;bold&lt;/b&gt;<br>1.000 W');
  });

  it('leaves no element behind when the tooltip HTML is parsed', () => {
    const host = document.createElement('div');
    host.innerHTML = tooltipLines('<img src=x onerror="window.__injected=1">', '<b>bold</b>');
    expect(host.querySelectorAll('img, b').length).toBe(0);
    expect(host.textContent).toBe('<img src=x onerror="window.__injected=1"><b>bold</b>');
  });
});
