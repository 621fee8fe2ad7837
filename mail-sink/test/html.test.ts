import { describe, expect, it } from 'vitest';
import { escapeHtml, markup, SafeHtml } from '../src/html.js';

describe('markup', () => {
  it('escapes interpolated text, lists of it, and leaves SafeHtml alone', () => {
    const name = `<b>"O'Brien" & co</b>`;
    expect(escapeHtml(name)).toBe('&lt;b&gt;&quot;O&#39;Brien&quot; &amp; co&lt;/b&gt;');
    expect(markup`<p title="${name}">${[name, markup`<i>${name}</i>`]}</p>`.value).toBe(
      '<p title="&lt;b&gt;&quot;O&#39;Brien&quot; &amp; co&lt;/b&gt;">' +
        '&lt;b&gt;&quot;O&#39;Brien&quot; &amp; co&lt;/b&gt;' +
        '<i>&lt;b&gt;&quot;O&#39;Brien&quot; &amp; co&lt;/b&gt;</i></p>',
    );
    expect(markup`${new SafeHtml('<br>')}${null}${undefined}${false}${0}`.value).toBe('<br>0');
  });
});
