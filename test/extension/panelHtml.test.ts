import assert from 'node:assert/strict';
import { createNonce } from '../../src/extension/createNonce';
import { escapeHtml } from '../../src/extension/escapeHtml';
import { panelHtml } from '../../src/extension/panelHtml';
import { buildPanelView } from '../../src/extension/panelView';
import { analyzed, HOSTILE_COLUMN, HOSTILE_ROW, SKI_SCHOOL, withHostileLabels } from './panelFixtures';

const CSP_SOURCE = 'https://file+.vscode-resource.vscode-cdn.net';
const base = {
  cspSource: CSP_SOURCE,
  nonce: 'abc123nonce',
  scriptUri: `${CSP_SOURCE}/ext/dist/webview.js`,
  styleUri: `${CSP_SOURCE}/ext/media/panel.css`,
};

/** Undoes escapeHtml's five references, as an HTML parser reading an attribute would. */
function unescapeAttribute(text: string): string {
  return text.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');
}

function attribute(html: string, name: string): string | undefined {
  const match = new RegExp(`${name}="([^"]*)"`).exec(html);
  return match ? unescapeAttribute(match[1]) : undefined;
}

describe('escapeHtml', () => {
  it('leaves no character that could open a tag or close an attribute', () => {
    for (const hostile of [HOSTILE_ROW, HOSTILE_COLUMN, '" onmouseover="alert(3)', "' autofocus onfocus='x"]) {
      const escaped = escapeHtml(hostile);
      assert.doesNotMatch(escaped, /[<>"']/, escaped);
      assert.equal(unescapeAttribute(escaped), hostile);
    }
  });

  it('escapes the ampersand first, so existing references stay literal', () => {
    assert.equal(escapeHtml('&lt;b&gt; & "x"'), '&amp;lt;b&amp;gt; &amp; &quot;x&quot;');
  });
});

describe('panelHtml', () => {
  it('sets the strict Content-Security-Policy with the nonce and gives only the bundle that nonce', () => {
    const html = panelHtml(base);
    assert.equal(
      attribute(html, 'content'),
      `default-src 'none'; style-src ${CSP_SOURCE}; img-src ${CSP_SOURCE} data:; script-src 'nonce-abc123nonce'`,
    );
    assert.match(html, /<meta http-equiv="Content-Security-Policy"/);
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    assert.deepEqual(scripts, [`<script nonce="abc123nonce" src="${base.scriptUri}">`]);
    assert.match(html, new RegExp(`<link rel="stylesheet" href="${base.styleUri.replace(/[.+]/g, '\\$&')}">`));
  });

  it('loads nothing from outside the webview\'s own resources and uses no inline style', () => {
    const html = panelHtml({ ...base, initialView: buildPanelView(analyzed(SKI_SCHOOL), 'k') });
    const urls = [...html.matchAll(/(?:https?:)?\/\/[^\s"'<>)]+/g)].map((m) => m[0]);
    assert.ok(urls.length >= 2);
    for (const url of urls) assert.ok(url.startsWith(CSP_SOURCE) || url.startsWith('//'), `unexpected resource ${url}`);
    assert.doesNotMatch(html, /\sstyle=|<style/i);
    assert.doesNotMatch(html, /\son\w+=/i, 'no inline event handlers');
  });

  it('embeds a hostile initial view as one inert attribute that parses back to the same view', () => {
    const view = buildPanelView(withHostileLabels(analyzed(SKI_SCHOOL)), 'k');
    const html = panelHtml({ ...base, initialView: view });
    assert.equal(html.match(/<\/script>/g)?.length, 1, 'only the bundle\'s own closing tag');
    assert.doesNotMatch(html, /<img/i);
    assert.doesNotMatch(html, /<script>alert/);
    const embedded = attribute(html, 'data-initial-view');
    assert.ok(embedded);
    assert.deepEqual(JSON.parse(embedded), view);
  });

  it('embeds no initial view when none is given', () => {
    assert.doesNotMatch(panelHtml(base), /data-initial-view/);
  });
});

describe('createNonce', () => {
  it('returns 128 random bits as hexadecimal, different every time', () => {
    const nonces = Array.from({ length: 200 }, () => createNonce());
    for (const nonce of nonces) assert.match(nonce, /^[0-9a-f]{32}$/);
    assert.equal(new Set(nonces).size, nonces.length);
  });
});
