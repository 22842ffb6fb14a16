import { memo } from 'react';
// Steps: the order a setup is built in, one light at a time, for rigging and for teaching. Each step places
// items (those selected when it is added) and carries a note; tapping a step shows the plan as it stands then.
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useShallow } from 'zustand/react/shallow';
import { useEditor, useEditorApi } from '../../canvas/editor/react';
import { colours, fonts, space } from '../../constants/theme';
import type { Step } from '../../model/document';
import { Button } from '../ui';
import { TextField } from './fields';

export const StepsPanel = memo(function StepsPanel({ activeStep, onShowStep }: { activeStep: number | null; onShowStep: (i: number | null) => void }) {
  const store = useEditorApi();
  const steps = useEditor((s) => s.doc.steps);
  // Names and ids only, so a drag (which changes positions) does not re-render the steps.
  const itemNames = useEditor(useShallow((s) => s.doc.items.map((i) => `${i.id}\u0000${i.label || i.id}`)));
  const selection = useEditor((s) => s.selection);
  const readOnly = useEditor((s) => s.readOnly);
  const names = new Map(itemNames.map((n) => n.split('\u0000') as [string, string]));
  const allIds = [...names.keys()];
  const set = (next: Step[], gestureKey?: string) => store.dispatch('setSteps', { steps: next, gestureKey });
  const placed = new Set(steps.flatMap((s) => s.itemIds));
  const addStep = () => {
    const ids = (selection.length ? selection : allIds).filter((id) => !placed.has(id));
    const n = steps.length + 1;
    let id = `step-${n}`;
    while (steps.some((s) => s.id === id)) id = `${id}x`;
    set([...steps, { id, title: `Step ${n}`, note: '', itemIds: ids }]);
  };
  return (
    <View style={s.wrap} accessibilityLabel="Steps">
      <Text style={s.heading}>Steps</Text>
      <Text style={s.dim}>Items in no step are there from the start. A new step places the selected items (or everything not yet placed).</Text>
      {steps.map((st, i) => (
        <View key={st.id} style={[s.step, activeStep === i && { borderColor: colours.accent }]}>
          <Pressable accessibilityRole="button" accessibilityLabel={`Show the plan at ${st.title || `step ${i + 1}`}`} onPress={() => onShowStep(activeStep === i ? null : i)}>
            <Text style={s.stepTitle}>
              {i + 1}. {st.title}
            </Text>
            <Text style={s.dim}>{st.itemIds.map((id) => names.get(id)).filter(Boolean).join(', ') || 'no items'}</Text>
          </Pressable>
          {readOnly ? (
            st.note ? <Text style={s.note}>{st.note}</Text> : null
          ) : (
            <>
              <TextField label="Title" value={st.title} onCommit={(v) => set(steps.map((x) => (x.id === st.id ? { ...x, title: v } : x)))} />
              <TextField label="Note" value={st.note} multiline onCommit={(v) => set(steps.map((x) => (x.id === st.id ? { ...x, note: v } : x)))} />
              <View style={{ flexDirection: 'row', gap: space.sm }}>
                {i > 0 ? <Button kind="quiet" label="Move up" onPress={() => set(swap(steps, i, i - 1))} /> : null}
                <Button kind="quiet" label="Remove step" onPress={() => set(steps.filter((x) => x.id !== st.id))} />
              </View>
            </>
          )}
        </View>
      ))}
      {!readOnly ? <Button label="Add a step" onPress={addStep} kind="quiet" /> : null}
    </View>
  );
});

function swap<T>(list: T[], a: number, b: number): T[] {
  const next = list.slice();
  [next[a], next[b]] = [next[b]!, next[a]!];
  return next;
}

const s = StyleSheet.create({
  wrap: { padding: space.lg, gap: space.sm },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18 },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 12 },
  note: { color: colours.text, fontFamily: fonts.sans, fontSize: 14, marginTop: space.xs },
  step: { borderWidth: 1, borderColor: colours.line, borderRadius: 10, padding: space.md, gap: space.xs },
  stepTitle: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
});
