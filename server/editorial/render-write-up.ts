import type { DOMOutputSpec } from '@tiptap/pm/model';
import { generateHTML } from '@tiptap/html/server';
import sanitizeHtml from 'sanitize-html';
import { LiveBlockNode, PhotoImageNode } from '../../shared/editorial/write-up-nodes';
import { writeUpExtensions } from '../../shared/editorial/write-up-extensions';
import {
  isAllowedLinkHref,
  liveBlockRefs,
  photoRefs,
  writeUpDocumentSchema,
  type LiveBlockKind,
  type WriteUpDocument,
} from '../../shared/schemas/write-up-document';

// The one way a write-up section becomes HTML, for the staff preview and the reader pages alike:
//   1. the stored JSON is checked against the allowed nodes and marks (shared/schemas/write-up-document.ts);
//   2. the editor's own schema turns it into HTML on the server (@tiptap/html), with live blocks and photos filled
//      in from current data through the caller's resolver;
//   3. sanitize-html passes only an allow-list of elements and attributes: links to http, https and mailto, no
//      script, event handler, style, frame or SVG, whatever the earlier steps let through.

/** What a live block shows: a small definition list (power design) or a table (results). */
export type LiveBlockContent =
  | { block: 'power-design'; productName: string; rows: { label: string; value: string }[] }
  | {
      block: 'results';
      productName: string;
      caption: string;
      columns: string[];
      rows: string[][];
      footnote?: string;
    };

/** A photo as the page shows it: its address (and optional sizes), alt text and caption. */
export interface PhotoContent {
  src: string;
  srcset?: string;
  width: number;
  height: number;
  altText: string;
  caption: string;
}

/**
 * Where a section's live data comes from. Staff pages and reader pages pass their own: the reader site gives
 * published photo addresses, the staff preview the signed-in ones. Null means "no longer there" (the block says so).
 */
export interface LiveBlockResolver {
  liveBlock(ref: { block: LiveBlockKind; entryId: number }): Promise<LiveBlockContent | null> | LiveBlockContent | null;
  photo(photoId: number): Promise<PhotoContent | null> | PhotoContent | null;
}

const liveKey = (block: string, entryId: unknown) => `${block}:${String(entryId)}`;

function liveBlockSpec(content: LiveBlockContent | null | undefined, block: string): DOMOutputSpec {
  if (!content) {
    return [
      'div',
      { class: 'live-block live-block-missing' },
      ['p', {}, 'This product’s data is no longer available.'],
    ];
  }
  if (content.block === 'power-design') {
    return [
      'div',
      { class: 'live-block live-block-power-design', 'data-live-block': block },
      ['p', { class: 'live-block-title' }, `Power design: ${content.productName}`],
      [
        'dl',
        {},
        ...content.rows.flatMap((row): DOMOutputSpec[] => [
          ['dt', {}, row.label],
          ['dd', {}, row.value],
        ]),
      ],
    ];
  }
  const table: DOMOutputSpec = [
    'table',
    { class: 'results-table' },
    ['caption', {}, content.caption],
    ['thead', {}, ['tr', {}, ...content.columns.map((column): DOMOutputSpec => ['th', { scope: 'col' }, column])]],
    [
      'tbody',
      {},
      ...content.rows.map((row): DOMOutputSpec => [
        'tr',
        {},
        ...row.map((cell, index): DOMOutputSpec => (index === 0 ? ['th', { scope: 'row' }, cell] : ['td', {}, cell])),
      ]),
    ],
  ];
  return [
    'div',
    { class: 'live-block live-block-results', 'data-live-block': block },
    table,
    ...(content.footnote ? [['p', { class: 'live-block-footnote' }, content.footnote] as DOMOutputSpec] : []),
  ];
}

function photoSpec(photo: PhotoContent | null | undefined, storedAlt: string): DOMOutputSpec {
  if (!photo) return ['p', { class: 'photo-missing' }, `[Photo no longer available: ${storedAlt}]`];
  const img: Record<string, string> = {
    src: photo.src,
    alt: photo.altText,
    width: String(photo.width),
    height: String(photo.height),
    loading: 'lazy',
  };
  if (photo.srcset) {
    img.srcset = photo.srcset;
    img.sizes = '(min-width: 48rem) 44rem, 100vw';
  }
  return [
    'figure',
    { class: 'photo' },
    ['img', img],
    ...(photo.caption ? [['figcaption', {}, photo.caption] as DOMOutputSpec] : []),
  ];
}

const allowedClasses = [
  'caution',
  'caution-title',
  'caution-body',
  'live-block',
  'live-block-missing',
  'live-block-power-design',
  'live-block-results',
  'live-block-title',
  'live-block-footnote',
  'results-table',
  'photo',
  'photo-missing',
];

const sanitizeOptions: sanitizeHtml.IOptions = {
  allowedTags: [
    'p',
    'h2',
    'h3',
    'h4',
    'strong',
    'em',
    'a',
    'br',
    'ul',
    'ol',
    'li',
    'blockquote',
    'aside',
    'div',
    'figure',
    'figcaption',
    'img',
    'dl',
    'dt',
    'dd',
    'table',
    'caption',
    'thead',
    'tbody',
    'tr',
    'th',
    'td',
  ],
  allowedAttributes: {
    a: ['href', 'rel', 'target'],
    img: ['src', 'srcset', 'sizes', 'alt', 'width', 'height', 'loading'],
    ol: ['start'],
    aside: ['class', 'role', 'data-caution'],
    div: ['class', 'data-live-block'],
    p: ['class'],
    figure: ['class'],
    table: ['class'],
    th: ['scope'],
  },
  allowedClasses: Object.fromEntries(['aside', 'div', 'p', 'figure', 'table'].map((tag) => [tag, allowedClasses])),
  allowedSchemes: ['http', 'https', 'mailto'],
  allowedSchemesByTag: { img: ['http', 'https'] },
  allowedSchemesAppliedToAttributes: ['href', 'src', 'srcset'],
  allowProtocolRelative: false,
  disallowedTagsMode: 'discard',
  // Elements whose text is code, not content: dropped with everything inside.
  nonTextTags: ['script', 'style', 'textarea', 'option', 'noscript', 'iframe', 'object', 'embed', 'svg', 'math'],
  transformTags: {
    a: (tagName, attribs) => {
      const href = attribs.href && isAllowedLinkHref(attribs.href) ? attribs.href : undefined;
      const attributes: Record<string, string> = { rel: 'noopener noreferrer nofollow' };
      if (href) attributes.href = href;
      if (attribs.target === '_blank') attributes.target = '_blank';
      return { tagName, attribs: attributes };
    },
  },
};

/** The allow-list pass on its own: any HTML in, only Benchwire's write-up elements and safe attributes out. */
export function sanitizeWriteUpHtml(html: string): string {
  return sanitizeHtml(html, sanitizeOptions);
}

/**
 * Safe HTML for one write-up section. `doc` is the stored JSON (checked again here: a document that is not a valid
 * write-up renders as a short notice, never as raw content). Live blocks and photos are filled in through
 * `resolver` from current data, every time.
 */
export async function renderSectionHtml(doc: unknown, resolver: LiveBlockResolver): Promise<string> {
  const parsed = writeUpDocumentSchema.safeParse(doc);
  if (!parsed.success) return '<p class="live-block-missing">This section could not be shown.</p>';
  const document: WriteUpDocument = parsed.data;

  const liveData = new Map<string, LiveBlockContent | null>();
  for (const ref of liveBlockRefs(document))
    liveData.set(liveKey(ref.block, ref.entryId), await resolver.liveBlock(ref));
  const photos = new Map<number, PhotoContent | null>();
  for (const photoId of photoRefs(document)) photos.set(photoId, await resolver.photo(photoId));

  const liveBlock = LiveBlockNode.extend({
    renderHTML({ node }) {
      return liveBlockSpec(liveData.get(liveKey(node.attrs.block, node.attrs.entryId)), String(node.attrs.block));
    },
  });
  const photo = PhotoImageNode.extend({
    renderHTML({ node }) {
      return photoSpec(photos.get(Number(node.attrs.photoId)), String(node.attrs.alt ?? ''));
    },
  });
  const html = generateHTML(document, writeUpExtensions({ liveBlock, photo }));
  return sanitizeWriteUpHtml(html);
}
