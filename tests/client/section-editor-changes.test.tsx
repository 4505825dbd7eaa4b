import { render, waitFor } from '@testing-library/react';
import type { Editor } from '@tiptap/react';
import { describe, expect, it, vi } from 'vitest';
import SectionEditor from '../../src/features/write-up/components/section-editor';
import type { WriteUpDocument } from '../../shared/schemas/write-up-document';

// Opening a section is not changing it: the write-up saves on change, and a save hands a signed-off section back to
// drafting. The editor library appends an empty paragraph after a list or a block that ends the text on its first
// transaction (a focus will do); that tidying must not count as the person's change, while their typing must.

const endsInList: WriteUpDocument = {
  type: 'doc',
  content: [
    { type: 'paragraph', content: [{ type: 'text', text: 'Every board was tested on the same open bench.' }] },
    {
      type: 'bulletList',
      content: [
        {
          type: 'listItem',
          content: [{ type: 'paragraph', content: [{ type: 'text', text: 'Stock, all-core load.' }] }],
        },
      ],
    },
  ],
};

const endsInLiveBlock: WriteUpDocument = {
  type: 'doc',
  content: [{ type: 'liveBlock', attrs: { block: 'results', entryId: 4 } }],
};

async function openEditor(content: WriteUpDocument) {
  const onChange = vi.fn();
  let editor: Editor | null = null;
  render(
    <SectionEditor
      initialContent={content}
      editable
      label="Product section: Test board"
      photos={[]}
      liveBlocks={[]}
      defaultEntryId={4}
      onReady={(created) => {
        editor = created;
      }}
      onChange={onChange}
    />,
  );
  await waitFor(() => expect(editor).not.toBeNull());
  return { editor: editor as unknown as Editor, onChange };
}

describe('the section editor reports only the person’s changes', () => {
  it.each([
    ['a list', endsInList],
    ['a live block', endsInLiveBlock],
  ])('focusing a text that ends in %s changes nothing, typing does', async (_, content) => {
    const { editor, onChange } = await openEditor(content);
    editor.commands.focus('end');
    editor.commands.blur();
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(onChange).not.toHaveBeenCalled();

    editor.commands.insertContent('A sentence typed by the writer.');
    expect(onChange).toHaveBeenCalledTimes(1);
    expect(JSON.stringify(editor.getJSON())).toContain('A sentence typed by the writer.');
  });
});
