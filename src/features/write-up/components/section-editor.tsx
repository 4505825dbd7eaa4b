import { createContext, useContext, useMemo, useState, type ReactNode } from 'react';
import {
  EditorContent,
  NodeViewWrapper,
  ReactNodeViewRenderer,
  useEditor,
  useEditorState,
  type Editor,
  type NodeViewProps,
} from '@tiptap/react';
import { Button } from '../../../components/ui/button';
import { cx } from '../../../lib/class-names';
import { writeUpExtensions } from '../../../../shared/editorial/write-up-extensions';
import { LiveBlockNode } from '../../../../shared/editorial/write-up-nodes';
import { cautionDefaultTexts, cautionTitles } from '../../../../shared/domain/editorial/caution-texts';
import {
  cautionKinds,
  isAllowedLinkHref,
  type CautionKind,
  type LiveBlockKind,
  type WriteUpDocument,
} from '../../../../shared/schemas/write-up-document';
import type { LiveBlockPreview, WriteUpPhoto } from '../../../../shared/schemas/write-ups';
import './write-up-editor.css';

const liveBlockLabels: Record<LiveBlockKind, string> = {
  'power-design': 'Power design',
  results: 'Results table',
};

const LiveBlocksContext = createContext<LiveBlockPreview[]>([]);

function LiveBlockView({ node, selected }: NodeViewProps) {
  const blocks = useContext(LiveBlocksContext);
  const block = node.attrs.block as LiveBlockKind;
  const entryId = Number(node.attrs.entryId);
  const preview = blocks.find((b) => b.block === block && b.entryId === entryId);
  return (
    <NodeViewWrapper
      className={cx('live-block-view', selected && 'is-selected')}
      data-live-block={block}
      // A named group, so that screen readers announce which live block this is (a plain div's label is not read).
      role="group"
      aria-label={`Live block: ${liveBlockLabels[block] ?? block}${preview ? ` of ${preview.productName}` : ''}`}
    >
      <p className="live-block-view-label" contentEditable={false}>
        Live block · {liveBlockLabels[block] ?? block}
        {preview ? ` · ${preview.productName}` : ''} — always shows current data
      </p>
      {preview ? (
        // Rendered and sanitised by the server renderer, the same HTML the public page gets.
        <div dangerouslySetInnerHTML={{ __html: preview.html }} />
      ) : (
        <p className="text-sm text-muted">This product is no longer in the roundup.</p>
      )}
    </NodeViewWrapper>
  );
}

const EditorLiveBlock = LiveBlockNode.extend({
  addNodeView() {
    return ReactNodeViewRenderer(LiveBlockView);
  },
});

function ToolbarButton({
  label,
  active,
  onClick,
  children,
  disabled,
}: {
  label: string;
  active?: boolean;
  onClick: () => void;
  children: ReactNode;
  disabled?: boolean;
}) {
  return (
    <button
      type="button"
      aria-label={label}
      title={label}
      aria-pressed={active === undefined ? undefined : active}
      disabled={disabled}
      onMouseDown={(event) => event.preventDefault()}
      onClick={onClick}
      className={cx(
        'min-h-8 min-w-8 rounded-[3px] border px-2 text-sm font-semibold',
        active ? 'border-copper bg-wash text-ink' : 'border-transparent text-ink hover:bg-wash',
        'disabled:opacity-50',
      )}
    >
      {children}
    </button>
  );
}

function Toolbar({ editor }: { editor: Editor }) {
  const state = useEditorState({
    editor,
    selector: ({ editor: e }) => ({
      h2: e.isActive('heading', { level: 2 }),
      h3: e.isActive('heading', { level: 3 }),
      bold: e.isActive('bold'),
      italic: e.isActive('italic'),
      bullet: e.isActive('bulletList'),
      ordered: e.isActive('orderedList'),
      quote: e.isActive('blockquote'),
      link: e.isActive('link'),
    }),
  });
  const [linkOpen, setLinkOpen] = useState(false);
  const [href, setHref] = useState('');
  const [linkError, setLinkError] = useState<string | null>(null);
  const chain = () => editor.chain().focus();

  const applyLink = () => {
    const value = href.trim();
    if (value === '') {
      chain().extendMarkRange('link').unsetLink().run();
      setLinkOpen(false);
      return;
    }
    if (!isAllowedLinkHref(value)) {
      setLinkError('Use a full address starting with https://, http:// or mailto:.');
      return;
    }
    chain().extendMarkRange('link').setLink({ href: value }).run();
    setLinkError(null);
    setLinkOpen(false);
  };

  return (
    <div className="border-b border-rule bg-surface px-2 py-1.5">
      <div role="toolbar" aria-label="Formatting" className="flex flex-wrap items-center gap-1">
        <ToolbarButton label="Heading" active={state.h2} onClick={() => chain().toggleHeading({ level: 2 }).run()}>
          H2
        </ToolbarButton>
        <ToolbarButton label="Subheading" active={state.h3} onClick={() => chain().toggleHeading({ level: 3 }).run()}>
          H3
        </ToolbarButton>
        <ToolbarButton label="Bold" active={state.bold} onClick={() => chain().toggleBold().run()}>
          <strong>B</strong>
        </ToolbarButton>
        <ToolbarButton label="Italic" active={state.italic} onClick={() => chain().toggleItalic().run()}>
          <em>I</em>
        </ToolbarButton>
        <ToolbarButton label="Bulleted list" active={state.bullet} onClick={() => chain().toggleBulletList().run()}>
          • List
        </ToolbarButton>
        <ToolbarButton label="Numbered list" active={state.ordered} onClick={() => chain().toggleOrderedList().run()}>
          1. List
        </ToolbarButton>
        <ToolbarButton label="Quote" active={state.quote} onClick={() => chain().toggleBlockquote().run()}>
          “ Quote
        </ToolbarButton>
        <ToolbarButton
          label="Link"
          active={state.link}
          onClick={() => {
            setHref((editor.getAttributes('link').href as string | undefined) ?? '');
            setLinkError(null);
            setLinkOpen((open) => !open);
          }}
        >
          Link
        </ToolbarButton>
      </div>
      {linkOpen && (
        <form
          className="mt-2 flex flex-wrap items-start gap-2"
          onSubmit={(event) => {
            event.preventDefault();
            applyLink();
          }}
        >
          <label className="flex min-w-0 flex-1 flex-col text-sm">
            <span className="font-medium">Link address (empty removes the link)</span>
            <input
              type="url"
              value={href}
              autoFocus
              onChange={(event) => setHref(event.target.value)}
              aria-invalid={linkError ? true : undefined}
              aria-describedby={linkError ? 'write-up-link-error' : undefined}
              className="min-h-9 rounded-[3px] border border-edge bg-surface px-2 text-ink placeholder:text-muted"
              placeholder="https://"
            />
            {linkError && (
              <span id="write-up-link-error" className="text-red">
                {linkError}
              </span>
            )}
          </label>
          <Button type="submit" size="sm" className="mt-5">
            Apply link
          </Button>
        </form>
      )}
    </div>
  );
}

function InsertBlocks({
  editor,
  photos,
  liveBlocks,
  defaultEntryId,
}: {
  editor: Editor;
  photos: WriteUpPhoto[];
  liveBlocks: LiveBlockPreview[];
  defaultEntryId: number | null;
}) {
  const products = useMemo(() => {
    const seen = new Map<number, string>();
    for (const block of liveBlocks) seen.set(block.entryId, block.productName);
    return [...seen.entries()];
  }, [liveBlocks]);
  const firstPhoto = photos.find((p) => p.entryId === defaultEntryId) ?? photos[0];
  const [photoId, setPhotoId] = useState(firstPhoto ? String(firstPhoto.id) : '');
  const [liveKind, setLiveKind] = useState<LiveBlockKind>('results');
  const [liveEntry, setLiveEntry] = useState(String(defaultEntryId ?? products[0]?.[0] ?? ''));
  const [caution, setCaution] = useState<CautionKind>('hot-surface');
  const selectClass = 'min-h-8 max-w-full rounded-[3px] border border-edge bg-surface px-1.5 text-sm';

  const insertPhoto = () => {
    const photo = photos.find((p) => String(p.id) === photoId);
    if (!photo) return;
    // After the selection, never over it: a just-inserted photo or block stays selected and must not be replaced.
    editor
      .chain()
      .focus()
      .insertContentAt(editor.state.selection.to, {
        type: 'image',
        attrs: { photoId: photo.id, alt: photo.altText, src: photo.previewUrl, title: null },
      })
      .run();
  };
  const insertLive = () => {
    const entryId = Number(liveEntry);
    if (!entryId) return;
    editor
      .chain()
      .focus()
      .insertContentAt(editor.state.selection.to, { type: 'liveBlock', attrs: { block: liveKind, entryId } })
      .run();
  };
  const insertCaution = () => {
    editor
      .chain()
      .focus()
      .insertContentAt(editor.state.selection.to, {
        type: 'caution',
        attrs: { kind: caution },
        content: [{ type: 'paragraph', content: [{ type: 'text', text: cautionDefaultTexts[caution] }] }],
      })
      .run();
  };

  return (
    <div
      role="group"
      aria-label="Insert blocks"
      className="grid gap-2 border-b border-rule bg-wash/60 px-2 py-2 text-sm md:grid-cols-3"
    >
      <div className="flex flex-wrap items-end gap-1.5">
        <label className="flex min-w-0 flex-col">
          <span className="text-xs font-medium text-muted">Photo (alt text comes with it)</span>
          <select
            className={selectClass}
            value={photoId}
            onChange={(e) => setPhotoId(e.target.value)}
            disabled={photos.length === 0}
          >
            {photos.length === 0 && <option value="">No photos in this roundup yet</option>}
            {photos.map((photo) => (
              <option key={photo.id} value={photo.id}>
                {photo.productName}: {photo.altText}
              </option>
            ))}
          </select>
        </label>
        <Button size="sm" onClick={insertPhoto} disabled={photos.length === 0}>
          Insert photo
        </Button>
      </div>
      <div className="flex flex-wrap items-end gap-1.5">
        <label className="flex flex-col">
          <span className="text-xs font-medium text-muted">Live block</span>
          <select
            className={selectClass}
            value={liveKind}
            onChange={(e) => setLiveKind(e.target.value as LiveBlockKind)}
          >
            <option value="results">Results table</option>
            <option value="power-design">Power design</option>
          </select>
        </label>
        <label className="flex min-w-0 flex-col">
          <span className="text-xs font-medium text-muted">of product</span>
          <select className={selectClass} value={liveEntry} onChange={(e) => setLiveEntry(e.target.value)}>
            {products.map(([entryId, name]) => (
              <option key={entryId} value={entryId}>
                {name}
              </option>
            ))}
          </select>
        </label>
        <Button size="sm" onClick={insertLive} disabled={products.length === 0}>
          Insert live block
        </Button>
      </div>
      <div className="flex flex-wrap items-end gap-1.5">
        <label className="flex flex-col">
          <span className="text-xs font-medium text-muted">Caution</span>
          <select className={selectClass} value={caution} onChange={(e) => setCaution(e.target.value as CautionKind)}>
            {cautionKinds.map((kind) => (
              <option key={kind} value={kind}>
                {cautionTitles[kind].replace('Caution: ', '')}
              </option>
            ))}
          </select>
        </label>
        <Button size="sm" onClick={insertCaution}>
          Insert caution
        </Button>
      </div>
    </div>
  );
}

export interface SectionEditorProps {
  initialContent: WriteUpDocument;
  editable: boolean;
  label: string;
  photos: WriteUpPhoto[];
  liveBlocks: LiveBlockPreview[];
  defaultEntryId: number | null;
  onReady: (editor: Editor) => void;
  onChange: () => void;
}

/** The write-up editor: Benchwire's vocabulary only (shared/editorial/write-up-extensions.ts). */
export default function SectionEditor({
  initialContent,
  editable,
  label,
  photos,
  liveBlocks,
  defaultEntryId,
  onReady,
  onChange,
}: SectionEditorProps) {
  const editor = useEditor({
    extensions: writeUpExtensions({ liveBlock: EditorLiveBlock }),
    content: initialContent,
    editable,
    immediatelyRender: true,
    // The strict Content-Security-Policy refuses inline style tags: the editor's rules ship in write-up-editor.css.
    injectCSS: false,
    editorProps: {
      attributes: {
        'aria-label': label,
        'aria-multiline': 'true',
        role: 'textbox',
        class: 'write-up-prose',
      },
    },
    onCreate: ({ editor: created }) => onReady(created),
    // Only what the person does counts as a change. The editor's own tidying (an empty paragraph it appends after a
    // list or a block at the end, on whatever happens first, focus included) must not save: a save hands a
    // signed-off section back to drafting, and merely opening or reading it is not a change.
    onUpdate: ({ transaction }) => {
      if (transaction.docChanged) onChange();
    },
  });
  if (!editor) return null;
  return (
    <LiveBlocksContext.Provider value={liveBlocks}>
      <div className="rounded-[3px] border border-rule bg-surface">
        {editable && (
          <>
            <Toolbar editor={editor} />
            <InsertBlocks editor={editor} photos={photos} liveBlocks={liveBlocks} defaultEntryId={defaultEntryId} />
          </>
        )}
        <EditorContent editor={editor} />
      </div>
    </LiveBlocksContext.Provider>
  );
}
