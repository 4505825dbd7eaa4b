import { z } from 'zod';
import { textProblem } from './text';

// The stored form of a write-up section: the editor's JSON document, limited to the nodes and marks Benchwire
// offers. The server refuses anything else, so a body sent around the editor cannot smuggle a node or attribute
// the renderer would have to guess about.

export const cautionKinds = ['overclocking', 'hot-surface', 'mains', 'test-conditions'] as const;
export type CautionKind = (typeof cautionKinds)[number];

export const liveBlockKinds = ['power-design', 'results'] as const;
export type LiveBlockKind = (typeof liveBlockKinds)[number];

/** Link targets a reader may follow: web pages and e-mail addresses, nothing that runs or embeds. */
export const allowedLinkProtocols = ['http:', 'https:', 'mailto:'] as const;

export function isAllowedLinkHref(href: string): boolean {
  // Browsers ignore tabs, newlines and leading control characters in a URL's scheme; refuse them outright.
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u0020\u007f]/.test(href)) return false;
  try {
    const url = new URL(href);
    return (allowedLinkProtocols as readonly string[]).includes(url.protocol);
  } catch {
    return false;
  }
}

export interface TextNode {
  type: 'text';
  text: string;
  marks?: Mark[];
}
export type Mark =
  | { type: 'bold' }
  | { type: 'italic' }
  | {
      type: 'link';
      attrs: {
        href: string;
        target?: string | null;
        rel?: string | null;
        class?: string | null;
        title?: string | null;
      };
    };
export interface HardBreakNode {
  type: 'hardBreak';
}
export type InlineNode = TextNode | HardBreakNode;
export interface ParagraphNode {
  type: 'paragraph';
  attrs?: Record<string, never> | { textAlign?: null };
  content?: InlineNode[];
}
export interface HeadingNode {
  type: 'heading';
  attrs: { level: 2 | 3 | 4 };
  content?: InlineNode[];
}
export interface BlockquoteNode {
  type: 'blockquote';
  content: BlockNode[];
}
export interface ListItemNode {
  type: 'listItem';
  content: BlockNode[];
}
export interface BulletListNode {
  type: 'bulletList';
  content: ListItemNode[];
}
export interface OrderedListNode {
  type: 'orderedList';
  attrs?: { start?: number; type?: string | null };
  content: ListItemNode[];
}
export interface ImageNode {
  type: 'image';
  attrs: {
    photoId: number;
    alt: string;
    src?: string | null;
    title?: string | null;
    width?: number | null;
    height?: number | null;
  };
}
export interface CautionNode {
  type: 'caution';
  attrs: { kind: CautionKind };
  content: ParagraphNode[];
}
export interface LiveBlockNode {
  type: 'liveBlock';
  attrs: { block: LiveBlockKind; entryId: number };
}
export type BlockNode =
  | ParagraphNode
  | HeadingNode
  | BlockquoteNode
  | BulletListNode
  | OrderedListNode
  | ImageNode
  | CautionNode
  | LiveBlockNode;
export interface WriteUpDocument {
  type: 'doc';
  content: BlockNode[];
}

const maxTextLength = 20_000;

/** Text in the document follows the house text rule: well-formed, no hidden controls (shared/schemas/text.ts). */
function checkedText(kind: 'single-line' | 'multi-line') {
  return z.string().check((payload) => {
    const problem = textProblem(payload.value, kind);
    if (problem) payload.issues.push({ code: 'custom', message: problem, input: payload.value, abort: true });
  });
}
const positiveId = z.number().int().positive().max(4_294_967_295);

const linkMark = z.strictObject({
  type: z.literal('link'),
  attrs: z.strictObject({
    href: z
      .string()
      .max(2000)
      .refine(isAllowedLinkHref, { message: 'Links may only go to http, https or mailto addresses.' }),
    target: z.enum(['_blank']).nullable().optional(),
    rel: z.string().max(100).nullable().optional(),
    class: z.null().optional(),
    title: z.string().max(300).nullable().optional(),
  }),
});

const markSchema: z.ZodType<Mark> = z.union([
  z.strictObject({ type: z.literal('bold') }),
  z.strictObject({ type: z.literal('italic') }),
  linkMark,
]);

const textNode: z.ZodType<TextNode> = z.strictObject({
  type: z.literal('text'),
  text: checkedText('multi-line').min(1).max(maxTextLength),
  marks: z.array(markSchema).max(3).optional(),
});
const hardBreakNode: z.ZodType<HardBreakNode> = z.strictObject({ type: z.literal('hardBreak') });
const inlineNode: z.ZodType<InlineNode> = z.union([textNode, hardBreakNode]);
const inlineContent = z.array(inlineNode).max(2000).optional();

const paragraphNode: z.ZodType<ParagraphNode> = z.strictObject({
  type: z.literal('paragraph'),
  attrs: z.strictObject({ textAlign: z.null().optional() }).optional(),
  content: inlineContent,
});

const headingNode: z.ZodType<HeadingNode> = z.strictObject({
  type: z.literal('heading'),
  // The section title is the page's level-2 heading; headings inside a section start one below it.
  attrs: z.strictObject({ level: z.union([z.literal(2), z.literal(3), z.literal(4)]) }),
  content: inlineContent,
});

const blockContent: z.ZodType<BlockNode[]> = z.lazy(() => z.array(blockNode).min(1).max(500));

const blockquoteNode: z.ZodType<BlockquoteNode> = z.strictObject({
  type: z.literal('blockquote'),
  get content() {
    return blockContent;
  },
});
const listItemNode: z.ZodType<ListItemNode> = z.strictObject({
  type: z.literal('listItem'),
  get content() {
    return blockContent;
  },
});
const bulletListNode: z.ZodType<BulletListNode> = z.strictObject({
  type: z.literal('bulletList'),
  content: z.array(listItemNode).min(1).max(500),
});
const orderedListNode: z.ZodType<OrderedListNode> = z.strictObject({
  type: z.literal('orderedList'),
  attrs: z
    .strictObject({
      start: z.number().int().min(0).max(100_000).optional(),
      type: z.enum(['1']).nullable().optional(),
    })
    .optional(),
  content: z.array(listItemNode).min(1).max(500),
});

const imageNode: z.ZodType<ImageNode> = z.strictObject({
  type: z.literal('image'),
  attrs: z.strictObject({
    photoId: positiveId,
    alt: checkedText('single-line').trim().min(1, 'Every photo needs its alt text.').max(300),
    // The address is decided when the page is rendered, from the photo id; what the editor had is ignored.
    src: z.string().max(2000).nullable().optional(),
    title: checkedText('single-line').max(300).nullable().optional(),
    width: z.number().int().positive().nullable().optional(),
    height: z.number().int().positive().nullable().optional(),
  }),
});

const cautionNode: z.ZodType<CautionNode> = z.strictObject({
  type: z.literal('caution'),
  attrs: z.strictObject({ kind: z.enum(cautionKinds) }),
  content: z.array(paragraphNode).min(1).max(20),
});

const liveBlockNode: z.ZodType<LiveBlockNode> = z.strictObject({
  type: z.literal('liveBlock'),
  attrs: z.strictObject({ block: z.enum(liveBlockKinds), entryId: positiveId }),
});

const blockNode: z.ZodType<BlockNode> = z.union([
  paragraphNode,
  headingNode,
  blockquoteNode,
  bulletListNode,
  orderedListNode,
  imageNode,
  cautionNode,
  liveBlockNode,
]);

const maxDepth = 12;
const maxStoredCharacters = 400_000;

function depthOf(node: unknown, depth = 0): number {
  if (depth > maxDepth + 1 || typeof node !== 'object' || node === null) return depth;
  const content = (node as { content?: unknown }).content;
  if (!Array.isArray(content)) return depth;
  let deepest = depth;
  for (const child of content) deepest = Math.max(deepest, depthOf(child, depth + 1));
  return deepest;
}

/** A whole section document. */
export const writeUpDocumentSchema: z.ZodType<WriteUpDocument> = z
  .unknown()
  .superRefine((value, context) => {
    if (depthOf(value) > maxDepth) {
      context.addIssue({ code: 'custom', message: `Lists and quotes may nest at most ${maxDepth} levels deep.` });
    } else if (JSON.stringify(value ?? null).length > maxStoredCharacters) {
      context.addIssue({ code: 'custom', message: 'The section is too long to store: split it.' });
    }
  })
  .pipe(
    z.strictObject({
      type: z.literal('doc'),
      content: z.array(blockNode).min(1).max(2000),
    }),
  ) as z.ZodType<WriteUpDocument>;

/** An empty section: one empty paragraph, as the editor starts. */
export function emptyWriteUpDocument(): WriteUpDocument {
  return { type: 'doc', content: [{ type: 'paragraph' }] };
}

/** The live blocks a document refers to, once each. */
export function liveBlockRefs(doc: WriteUpDocument): LiveBlockNode['attrs'][] {
  const found = new Map<string, LiveBlockNode['attrs']>();
  walk(doc, (node) => {
    if (node.type === 'liveBlock') found.set(`${node.attrs.block}:${node.attrs.entryId}`, node.attrs);
  });
  return [...found.values()];
}

/** The photo ids a document shows, once each. */
export function photoRefs(doc: WriteUpDocument): number[] {
  const found = new Set<number>();
  walk(doc, (node) => {
    if (node.type === 'image') found.add(node.attrs.photoId);
  });
  return [...found];
}

type AnyNode = BlockNode | ListItemNode | InlineNode | WriteUpDocument;

function walk(node: AnyNode, visit: (node: AnyNode) => void) {
  visit(node);
  const content = (node as { content?: AnyNode[] }).content;
  if (Array.isArray(content)) for (const child of content) walk(child, visit);
}
