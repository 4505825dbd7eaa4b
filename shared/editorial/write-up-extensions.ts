import type { Extensions } from '@tiptap/core';
import StarterKit from '@tiptap/starter-kit';
import { isAllowedLinkHref } from '../schemas/write-up-document';
import { CautionNode, LiveBlockNode, PhotoImageNode } from './write-up-nodes';

/**
 * The editor's vocabulary: headings (levels 2–4), paragraphs, lists, block quotes, bold, italic, links to web and
 * mail addresses, line breaks, photos of the roundup, caution blocks and live blocks. Nothing else is offered, and
 * the server accepts nothing else (shared/schemas/write-up-document.ts).
 */
export function writeUpExtensions(overrides: { liveBlock?: Extensions[number]; photo?: Extensions[number] } = {}) {
  return [
    StarterKit.configure({
      code: false,
      codeBlock: false,
      strike: false,
      underline: false,
      horizontalRule: false,
      heading: { levels: [2, 3, 4] },
      link: {
        openOnClick: false,
        autolink: true,
        defaultProtocol: 'https',
        protocols: ['mailto'],
        isAllowedUri: (url) => isAllowedLinkHref(url),
        HTMLAttributes: { target: null, rel: 'noopener noreferrer nofollow' },
      },
    }),
    CautionNode,
    overrides.liveBlock ?? LiveBlockNode,
    overrides.photo ?? PhotoImageNode,
  ] satisfies Extensions;
}
