/**
 * Hostile text, shared by the API and browser tests. Each entry says what it tries. Sources for the kinds: OWASP
 * XSS Filter Evasion Cheat Sheet (script tags, event attributes, javascript: URLs, SVG), OWASP SQL Injection
 * Prevention Cheat Sheet (quote and comment meta-characters), OWASP HTTP Response Splitting / CRLF injection, and
 * Unicode Technical Report #36 §2.4 (bidirectional and invisible controls).
 */
export interface HostileString {
  name: string;
  value: string;
  /** What may legitimately happen: kept as typed, or refused because the text rules forbid it. */
  expect: 'kept' | 'kept-or-refused' | 'refused';
}

export const hostileStrings: readonly HostileString[] = [
  { name: 'script tag', value: '<script>window.__hostile = 1</script>', expect: 'kept-or-refused' },
  { name: 'event attribute', value: '"><img src=x onerror="window.__hostile=1">', expect: 'kept-or-refused' },
  { name: 'javascript URL', value: 'javascript:window.__hostile=1//', expect: 'kept-or-refused' },
  {
    name: 'SVG payload',
    value: '<svg onload="window.__hostile=1"><script>window.__hostile=2</script></svg>',
    expect: 'kept-or-refused',
  },
  { name: 'SQL quote and comment', value: "Board'); DROP TABLE users; --", expect: 'kept-or-refused' },
  { name: 'SQL tautology and LIKE wildcards', value: 'x" OR "1"="1 %_\\', expect: 'kept-or-refused' },
  { name: 'template and entity text', value: '{{7*7}} ${7*7} &lt;b&gt; &amp;', expect: 'kept-or-refused' },
  {
    name: 'CRLF header injection',
    value: 'Helix board\r\nBcc: list@example.net\r\nX-Injected: 1',
    expect: 'kept-or-refused',
  },
  { name: 'right-to-left override', value: 'Board \u202Egnp.exe', expect: 'refused' },
  { name: 'zero-width joiner and space', value: 'Bo\u200Bard\u200D', expect: 'kept-or-refused' },
  { name: 'very long', value: 'VRM '.repeat(5_000), expect: 'kept-or-refused' },
  { name: 'astral and combining characters', value: 'Ünïcödé board 🔥 e\u0301', expect: 'kept-or-refused' },
];

/** Bytes that are not UTF-8 (a lone continuation byte, an overlong slash, a cut-off sequence), inside a JSON body. */
export const nonUtf8Body = (field: string) =>
  Buffer.concat([
    Buffer.from(`{"${field}":"Board `),
    Buffer.from([0x80, 0xc0, 0xaf, 0xe2, 0x82]),
    Buffer.from(' name"}'),
  ]);

/** Markers a page must never show as live markup: the browser tests look for the effect of each payload. */
export const hostileMarker = '__hostile';
