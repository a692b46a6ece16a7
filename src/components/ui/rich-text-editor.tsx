import { useEffect } from 'react';
import { EditorContent, useEditor } from '@tiptap/react';
import StarterKit from '@tiptap/starter-kit';
import { TaskItem, TaskList } from '@tiptap/extension-list';
import { Button } from './button';

type Props = { label: string; initialHtml?: string; onChange: (html: string) => void; /** Puts the caret at the end once loaded (the person clicked to write). */ autofocus?: boolean };

/** Rich text with headings, lists, bold/italic, links and task lists; the server sanitises what it stores. */
export function RichTextEditor({ label, initialHtml = '', onChange, autofocus = false }: Props) {
  const editor = useEditor({
    extensions: [StarterKit.configure({ link: { openOnClick: false, protocols: ['http', 'https', 'mailto'] } }), TaskList, TaskItem.configure({ nested: true })],
    content: initialHtml,
    editorProps: { attributes: { 'aria-label': label, role: 'textbox', 'aria-multiline': 'true', class: 'prose-editor min-h-32 p-2 focus:outline-none' } },
    onUpdate: ({ editor: e }) => onChange(e.getHTML()),
  });
  useEffect(() => {
    if (!autofocus || !editor) return;
    // The caret goes to the end where the browser can place it there (Selection.modify; test DOMs lack it).
    const canPlaceAtEnd = typeof (window.getSelection() as (Selection & { modify?: unknown }) | null)?.modify === 'function';
    // Through a chain: a remount (the notes restored from the device) may run this for an editor
    // already torn down, whose `commands` is gone; its chain does nothing instead of throwing.
    editor.chain().focus(canPlaceAtEnd ? 'end' : null).run();
  }, [autofocus, editor]);
  if (!editor) return null;
  const tool = (name: string, active: boolean, run: () => void) => (
    <Button tone="tool" pressed={active} onClick={run}>
      {name}
    </Button>
  );
  return (
    <div className="rounded-md border border-line bg-field">
      <div className="flex flex-wrap gap-1 border-b border-line p-1" role="toolbar" aria-label={`${label} formatting`}>
        {tool('B', editor.isActive('bold'), () => editor.chain().focus().toggleBold().run())}
        {tool('I', editor.isActive('italic'), () => editor.chain().focus().toggleItalic().run())}
        {tool('Heading', editor.isActive('heading', { level: 2 }), () => editor.chain().focus().toggleHeading({ level: 2 }).run())}
        {tool('• List', editor.isActive('bulletList'), () => editor.chain().focus().toggleBulletList().run())}
        {tool('1. List', editor.isActive('orderedList'), () => editor.chain().focus().toggleOrderedList().run())}
        {tool('☐ Tasks', editor.isActive('taskList'), () => editor.chain().focus().toggleTaskList().run())}
        {tool('Link', editor.isActive('link'), () => {
          const href = window.prompt('Link address (https://…)');
          if (href) editor.chain().focus().extendMarkRange('link').setLink({ href }).run();
          else editor.chain().focus().unsetLink().run();
        })}
      </div>
      <EditorContent editor={editor} />
    </div>
  );
}
