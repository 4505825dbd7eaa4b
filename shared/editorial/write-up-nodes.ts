import { Node, mergeAttributes } from '@tiptap/core';
import Image from '@tiptap/extension-image';
import { cautionKinds, liveBlockKinds, type CautionKind } from '../schemas/write-up-document';
import { cautionTitles } from '../domain/editorial/caution-texts';

// The write-up's own editor nodes, shared by the staff editor (which adds its views) and the server renderer (which
// renders them from current data). Names and attributes match shared/schemas/write-up-document.ts.

/** A safety note: a heading naming the kind of caution, then the writer's paragraphs. */
export const CautionNode = Node.create({
  name: 'caution',
  group: 'block',
  content: 'paragraph+',
  defining: true,
  addAttributes() {
    return {
      kind: {
        default: 'overclocking' as CautionKind,
        parseHTML: (element: HTMLElement) => {
          const value = element.getAttribute('data-caution');
          return cautionKinds.find((kind) => kind === value) ?? 'overclocking';
        },
        renderHTML: (attributes: { kind: CautionKind }) => ({ 'data-caution': attributes.kind }),
      },
    };
  },
  parseHTML() {
    return [{ tag: 'aside[data-caution]', contentElement: 'div.caution-body' }];
  },
  renderHTML({ node, HTMLAttributes }) {
    const kind = node.attrs.kind as CautionKind;
    return [
      'aside',
      mergeAttributes(HTMLAttributes, { class: 'caution', role: 'note' }),
      ['p', { class: 'caution-title', contenteditable: 'false' }, cautionTitles[kind] ?? cautionTitles.overclocking],
      ['div', { class: 'caution-body' }, 0],
    ];
  },
});

/**
 * A block that shows current data about one product of the roundup (its power design, or its results table). Only
 * the reference is stored; what it shows is rendered from the data every time.
 */
export const LiveBlockNode = Node.create({
  name: 'liveBlock',
  group: 'block',
  atom: true,
  selectable: true,
  draggable: true,
  addAttributes() {
    return {
      block: {
        default: 'results',
        parseHTML: (element: HTMLElement) => {
          const value = element.getAttribute('data-live-block');
          return liveBlockKinds.find((kind) => kind === value) ?? 'results';
        },
        renderHTML: (attributes: { block: string }) => ({ 'data-live-block': attributes.block }),
      },
      entryId: {
        default: null,
        parseHTML: (element: HTMLElement) => Number(element.getAttribute('data-entry-id')) || null,
        renderHTML: (attributes: { entryId: number | null }) => ({ 'data-entry-id': String(attributes.entryId) }),
      },
    };
  },
  parseHTML() {
    return [{ tag: 'div[data-live-block]' }];
  },
  renderHTML({ HTMLAttributes }) {
    return ['div', mergeAttributes(HTMLAttributes, { class: 'live-block' })];
  },
});

/** A photo of the roundup: the image extension, plus the id of the photo it shows (its address comes from the id). */
export const PhotoImageNode = Image.extend({
  addAttributes() {
    return {
      ...this.parent?.(),
      photoId: {
        default: null,
        parseHTML: (element: HTMLElement) => Number(element.getAttribute('data-photo-id')) || null,
        renderHTML: (attributes: { photoId: number | null }) => ({ 'data-photo-id': String(attributes.photoId) }),
      },
    };
  },
}).configure({ inline: false, allowBase64: false });
