import { Window } from 'happy-dom';
import { describe, expect, it } from 'vitest';
import { WriteUpSectionEntity } from '../../../server/entities/write-up-section.entity';
import { renderSectionHtml, sanitizeWriteUpHtml } from '../../../server/editorial/render-write-up';
import { testApp, testDataSource } from '../support/test-app';
import { roundupInWriting } from './support/write-up-fixtures';

// Stored-XSS corpus. The payload shapes follow the OWASP XSS Filter Evasion Cheat Sheet (script tags, event
// handler attributes, javascript:/vbscript:/data: URLs with case, whitespace and entity tricks, SVG and MathML
// payloads, iframes, style attributes, malformed nesting); the cheat sheet is the source, the strings are ours.

/** Problems a rendered fragment must not have, found by parsing it as a browser would. */
function dangerIn(html: string): string[] {
  const window = new Window();
  const container = window.document.createElement('div');
  container.innerHTML = html;
  const problems: string[] = [];
  for (const element of container.querySelectorAll('*')) {
    const tag = element.tagName.toLowerCase();
    if (
      ['script', 'iframe', 'object', 'embed', 'svg', 'math', 'style', 'link', 'meta', 'base', 'form', 'frame'].includes(
        tag,
      )
    ) {
      problems.push(`<${tag}>`);
    }
    for (const attribute of Array.from(element.attributes)) {
      const name = attribute.name.toLowerCase();
      if (name.startsWith('on')) problems.push(`${tag}[${name}]`);
      if (name === 'style') problems.push(`${tag}[style]`);
      if (['href', 'src', 'srcset', 'action', 'formaction', 'xlink:href'].includes(name)) {
        // eslint-disable-next-line no-control-regex -- browsers drop these from a URL, so must the check
        const value = (attribute.value ?? '').replace(/[\s\u0000-\u001f]/g, '').toLowerCase();
        if (/^(javascript|vbscript|data|file):/.test(value)) problems.push(`${tag}[${name}=${attribute.value}]`);
        if (name === 'href' && !/^(https?:|mailto:)/.test(value)) problems.push(`${tag}[href=${attribute.value}]`);
      }
    }
  }
  window.close();
  return problems;
}

const text = (value: string) => ({ type: 'text', text: value });
const para = (...content: unknown[]) => ({ type: 'paragraph', content });
const doc = (...content: unknown[]) => ({ type: 'doc', content });
const link = (href: string, extra: Record<string, unknown> = {}) =>
  para({ type: 'text', text: 'click', marks: [{ type: 'link', attrs: { href, ...extra } }] });

/** Bodies the schema refuses outright (400): they never reach storage. */
const refused: [string, unknown][] = [
  ['javascript: link', doc(link('javascript:alert(1)'))],
  ['mixed-case javascript: link', doc(link('JaVaScRiPt:alert(1)'))],
  ['javascript: link with a tab in the scheme', doc(link('java\tscript:alert(1)'))],
  ['javascript: link with leading spaces', doc(link('  javascript:alert(1)'))],
  ['entity-encoded javascript: link', doc(link('&#106;avascript:alert(1)'))],
  ['percent-encoded javascript: link', doc(link('%6Aavascript:alert(1)'))],
  ['vbscript: link', doc(link('vbscript:msgbox(1)'))],
  ['data: HTML link', doc(link('data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg=='))],
  ['data: SVG link', doc(link('data:image/svg+xml,<svg onload=alert(1)>'))],
  ['file: link', doc(link('file:///etc/passwd'))],
  ['link with an onclick attribute', doc(link('https://example.org/', { onclick: 'alert(1)' }))],
  ['link with a style attribute', doc(link('https://example.org/', { style: 'position:fixed;inset:0' }))],
  [
    'paragraph with a style attribute',
    doc({ type: 'paragraph', attrs: { style: 'background:red' }, content: [text('x')] }),
  ],
  [
    'paragraph with an onmouseover attribute',
    doc({ type: 'paragraph', attrs: { onmouseover: 'alert(1)' }, content: [text('x')] }),
  ],
  ['a script node', doc({ type: 'script', content: [text('alert(1)')] })],
  ['an iframe node', doc({ type: 'iframe', attrs: { src: 'https://example.org/' } })],
  ['an SVG node', doc({ type: 'svg', attrs: { onload: 'alert(1)' } })],
  ['a raw HTML node', doc({ type: 'html', content: '<img src=x onerror=alert(1)>' })],
  ['an unknown mark', doc(para({ type: 'text', text: 'x', marks: [{ type: 'textStyle', attrs: { color: 'red' } }] }))],
  [
    'an image with an onerror attribute',
    doc({ type: 'image', attrs: { photoId: 1, alt: 'Board', onerror: 'alert(1)' } }),
  ],
  ['an image without alt text', doc({ type: 'image', attrs: { photoId: 1, alt: '  ' } })],
  ['a heading of level 1', doc({ type: 'heading', attrs: { level: 1 }, content: [text('Title')] })],
  ['text straight in the document (malformed nesting)', doc(text('<b>loose</b>'))],
  ['a list item outside a list (malformed nesting)', doc({ type: 'listItem', content: [para(text('x'))] })],
  [
    'a paragraph inside a text node (malformed nesting)',
    doc(para({ type: 'text', text: 'x', content: [para(text('y'))] })),
  ],
  ['a caution of an unknown kind', doc({ type: 'caution', attrs: { kind: '"><script>' }, content: [para(text('x'))] })],
  ['a live block with a script in its kind', doc({ type: 'liveBlock', attrs: { block: '<script>', entryId: 1 } })],
  ['a document that is a string of HTML', '<p>hello</p><script>alert(1)</script>'],
  [
    'a document nested 40 quotes deep',
    doc(
      ...[Array.from({ length: 40 }).reduce((inner) => ({ type: 'blockquote', content: [inner] }), para(text('deep')))],
    ),
  ],
];

/** Bodies the schema accepts (markup typed as text): they are stored, and must render inert. */
const accepted: [string, unknown][] = [
  ['a script tag typed as text', doc(para(text('<script>alert(document.cookie)</script>')))],
  ['an img onerror typed as text', doc(para(text('<img src=x onerror=alert(1)>')))],
  ['an SVG onload typed as text', doc(para(text('<svg/onload=alert(1)>')))],
  [
    'entity-encoded markup typed as text',
    doc(para(text('&lt;script&gt;alert(1)&lt;/script&gt; &#60;img src=x onerror=alert(1)&#62;'))),
  ],
  [
    'an iframe typed into a heading',
    doc({ type: 'heading', attrs: { level: 3 }, content: [text('</h3><iframe src="javascript:alert(1)"></iframe>')] }),
  ],
  [
    'a style tag typed into a quote',
    doc({ type: 'blockquote', content: [para(text('<style>body{display:none}</style>'))] }),
  ],
  [
    'an attribute break-out in alt text',
    doc({ type: 'image', attrs: { photoId: 999999, alt: '"><svg onload=alert(1)>' } }),
  ],
  [
    'a link title with a quote break-out',
    doc(link('https://example.org/?q="><script>alert(1)</script>', { title: '" onmouseover="alert(1)' })),
  ],
  [
    'a caution with markup in it',
    doc({ type: 'caution', attrs: { kind: 'hot-surface' }, content: [para(text('<b onclick=alert(1)>hot</b>'))] }),
  ],
  [
    'mailto and https links',
    doc(
      para(
        { type: 'text', text: 'mail', marks: [{ type: 'link', attrs: { href: 'mailto:desk@soaksheet.example' } }] },
        {
          type: 'text',
          text: ' web',
          marks: [{ type: 'link', attrs: { href: 'https://soaksheet.example/a?b=1&c=2', target: '_blank' } }],
        },
      ),
    ),
  ],
];

describe('stored XSS: bodies posted straight to the API, around the editor', () => {
  it('refuses every body with a disallowed node, mark, attribute or link scheme, and stores nothing of it', async () => {
    const app = await testApp();
    const { writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const overview = (await writer.agent.get(`/api/roundups/${roundupId}/write-up`)).body;
    const intro = overview.sections[0] as { id: number; version: number };
    const before = (await writer.agent.get(`/api/write-up/sections/${intro.id}`)).body;

    for (const [label, content] of refused) {
      const response = await writer.agent
        .put(`/api/write-up/sections/${intro.id}`)
        .send({ baseVersion: intro.version, content });
      expect(response.status, label).toBe(400);
      expect(response.body.error.code, label).toBe('validation_failed');
    }
    const after = (await writer.agent.get(`/api/write-up/sections/${intro.id}`)).body;
    expect(after.version).toBe(before.version);
    expect(after.content).toEqual(before.content);
  });

  it('renders every accepted body inert: the section, the revision and the preview page hold no script, handler, style, frame, SVG or unsafe link', async () => {
    const app = await testApp();
    const { writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const overview = (await writer.agent.get(`/api/roundups/${roundupId}/write-up`)).body;
    const conclusion = overview.sections.at(-1) as { id: number; version: number };
    let version = conclusion.version;

    for (const [label, content] of accepted) {
      const response = await writer.agent
        .put(`/api/write-up/sections/${conclusion.id}`)
        .send({ baseVersion: version, content });
      expect(response.status, `${label}: ${response.text}`).toBe(200);
      version = response.body.version;

      const revisions = (await writer.agent.get(`/api/write-up/sections/${conclusion.id}/revisions`)).body.revisions;
      const revision = await writer.agent.get(`/api/write-up/sections/${conclusion.id}/revisions/${revisions[0].id}`);
      expect(dangerIn(revision.body.html), label).toEqual([]);
      expect(revision.body.html, label).not.toMatch(/<(script|iframe|svg|style)|<[^>]*\s(on\w+|style)\s*=/i);

      const preview = await writer.agent.get(`/api/roundups/${roundupId}/write-up/preview`);
      expect(preview.status).toBe(200);
      expect(preview.headers['content-security-policy']).toContain("default-src 'none'");
      const article = /<article>([\s\S]*)<\/article>/.exec(preview.text)?.[1] ?? '';
      expect(dangerIn(article), label).toEqual([]);
    }
    const last = await writer.agent.get(`/api/roundups/${roundupId}/write-up/preview`);
    expect(last.text).toContain('href="mailto:desk@soaksheet.example"');
    expect(last.text).toContain('rel="noopener noreferrer nofollow"');
  });

  it('a document written straight into the database around the API still renders as a notice, not as its content', async () => {
    const app = await testApp();
    const { writer, roundupId } = await roundupInWriting(app, { products: 1 });
    const intro = (await writer.agent.get(`/api/roundups/${roundupId}/write-up`)).body.sections[0] as { id: number };
    const ds = await testDataSource();
    await ds
      .getRepository(WriteUpSectionEntity)
      .update(
        { id: intro.id },
        { content: doc(link('javascript:alert(1)'), { type: 'script', content: [text('alert(1)')] }) as never },
      );
    const preview = await writer.agent.get(`/api/roundups/${roundupId}/write-up/preview`);
    expect(preview.text).toContain('This section could not be shown.');
    expect(dangerIn(/<article>([\s\S]*)<\/article>/.exec(preview.text)?.[1] ?? '')).toEqual([]);
    const direct = await renderSectionHtml(doc(link('javascript:alert(1)')), {
      liveBlock: () => null,
      photo: () => null,
    });
    expect(direct).not.toContain('javascript');
  });

  it('the allow-list pass alone strips raw HTML payloads', () => {
    const payloads = [
      '<script>alert(1)</script><p>ok</p>',
      '<img src=x onerror=alert(1)>',
      '<svg><script>alert(1)</script></svg>',
      '<svg onload=alert(1)><circle r=5 /></svg>',
      '<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>',
      '<a href="javascript:alert(1)">x</a>',
      '<a href="JAVASCRIPT&colon;alert(1)">x</a>',
      '<a href="&#106;&#97;&#118;&#97;&#115;&#99;&#114;&#105;&#112;&#116;&#58;alert(1)">x</a>',
      '<a href="java&#x09;script:alert(1)">x</a>',
      '<a href="data:text/html,<script>alert(1)</script>">x</a>',
      '<a href="//evil.example/">x</a>',
      '<iframe src="https://example.org/"></iframe>',
      '<p style="background:url(javascript:alert(1))">x</p>',
      '<div onclick="alert(1)" class="caution">x</div>',
      '<p><b><i>mis</b>nested</i></p><p onmouseover=alert(1)>x',
      '<object data="x.swf"></object><embed src="x.swf">',
      '<img src="data:image/svg+xml;base64,PHN2ZyBvbmxvYWQ9YWxlcnQoMSk+">',
      '<form action="javascript:alert(1)"><button formaction="javascript:alert(1)">go</button></form>',
      '<table><tr><td background="javascript:alert(1)">x</td></tr></table>',
      '<<script>script>alert(1)<</script>/script>',
    ];
    for (const payload of payloads) {
      const clean = sanitizeWriteUpHtml(payload);
      expect(dangerIn(clean), payload).toEqual([]);
      expect(clean, payload).not.toMatch(/<script|javascript:|onerror|onload|<iframe|<svg|style=/i);
    }
  });
});
