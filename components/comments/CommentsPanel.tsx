// The comments section of the editor (a tab on a phone, a section on a wide screen): the thread for the
// signed-in member, with the item selected on the plan offered as the pin.
import { useEditor, useEditorLate } from '../../canvas/editor/react';
import { useMe } from '../../hooks/me';
import { itemName } from '../../model/classes';
import type { Units } from '../../model/units';
import { CommentThread } from './CommentThread';

export function CommentsPanel({ setupId, units, canWrite }: { setupId: string; units: Units; canWrite: boolean }) {
  const me = useMe();
  const doc = useEditorLate((s) => s.doc);
  const selected = useEditor((s) => (s.selection.length === 1 ? s.selection[0]! : null));
  const item = selected ? doc.items.find((i) => i.id === selected) : undefined;
  if (!me.data) return null;
  return <CommentThread setupId={setupId} doc={doc} units={units} me={me.data.user} canWrite={canWrite} selectedItem={item ? { id: item.id, label: itemName(item) } : null} />;
}
