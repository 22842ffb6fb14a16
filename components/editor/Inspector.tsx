// The item inspector: the selected item's properties with units, changed through editor actions.
import { memo, useCallback, useDeferredValue } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { actions } from '../../canvas/editor/actions';
import { useEditor, useEditorApi, useSettled } from '../../canvas/editor/react';
import { itemById } from '../../canvas/editor/state';
import { colours, fonts, space } from '../../constants/theme';
import type { Item, ItemOf } from '../../model/document';
import { fieldLabel, rangeOf, type FieldContext, type FieldSpec, type Patch as FieldPatch, type ReadingFieldSpec } from '../../model/fields';
import { fieldsOf, itemNames, kinds } from '../../model/kinds';
import type { Units } from '../../model/units';
import { Body } from '../ui';
import { ChoiceField, NumberField, SwitchField, TextField } from './fields';
import { ReadingForm, type ReadingStart } from './ReadingForm';
import { count } from '../../model/format';

type Patch = FieldPatch | ((item: Item) => FieldPatch);

function useUpdate(id: string) {
  const store = useEditorApi();
  return useCallback((patch: Patch) => store.dispatch('updateItem', { id, patch }), [store, id]);
}

export const Inspector = memo(function Inspector({ units }: { units: Units }) {
  // The form is a large render: during a drag it holds the item as it was when the gesture began and catches
  // up when the hand lifts; otherwise it follows at low priority (React renders the deferred value in the
  // background and can interrupt it), so a press or a drag frame never waits for it.
  const selection = useSettled((s) => s.selection);
  const current = useSettled((s) => (s.selection.length === 1 ? itemById(s, s.selection[0]!) : undefined));
  const item = useDeferredValue(current);
  const readOnly = useEditor((s) => s.readOnly);
  // The item's name as the meter and the crew sheet give it ("Light 2", or its label): two look-alike strips
  // must not both be headed "Light".
  const name = useSettled((s) => (item ? itemNames(s.doc.items).get(item.id) : undefined));
  if (!item) {
    return (
      <View style={s.wrap}>
        <Body dim>{selection.length > 1 ? `${count(selection.length, 'item')} selected. Drag any of them to move them together.` : 'Tap an item on the plan to see and change its settings, or add one from the kit.'}</Body>
        {selection.length > 1 && !readOnly ? <SelectionActions /> : null}
      </View>
    );
  }
  return (
    <View style={s.wrap} pointerEvents={readOnly ? 'none' : 'auto'} accessibilityLabel={`Settings of ${heading(name, item)}`} testID={`inspector-${item.id}`}>
      <Text style={s.heading}>{heading(name, item)}</Text>
      {/* Keyed by item: a field's typed text, open list and callbacks belong to one item and never carry over. */}
      <ItemFields key={item.id} item={item} units={units} />
      {/* Duplicate, lock and delete after the settings: the sheet opens at what is changed most. */}
      {!readOnly ? <SelectionActions /> : null}
    </View>
  );
});

/** The inspector's heading: the item's name, with its kind when a label hides it ("Kicker · Light"). */
function heading(name: string | undefined, item: Item): string {
  const kind = kinds[item.kind].label;
  if (!name) return kind;
  return name.startsWith(kind) ? name : `${name} · ${kind}`;
}

/** Duplicate, lock and delete as buttons too: a phone has no keyboard shortcuts. */
function SelectionActions() {
  const store = useEditorApi();
  const locked = useEditor((s) => s.doc.items.some((i) => s.selection.includes(i.id) && i.locked));
  const button = (name: 'duplicateSelection' | 'toggleLock' | 'deleteSelection', label: string) => (
    <Pressable key={name} accessibilityRole="button" accessibilityLabel={label} onPress={() => store.dispatch(name)} style={({ pressed }) => [s.action, pressed && { backgroundColor: colours.panelRaised }]}>
      <Text style={s.actionText}>{label}</Text>
    </Pressable>
  );
  return (
    <View style={s.actions}>
      {button('duplicateSelection', actions.duplicateSelection.label)}
      {button('toggleLock', locked ? 'Unlock' : 'Lock')}
      {button('deleteSelection', actions.deleteSelection.label)}
    </View>
  );
}

/**
 * The item's fields, rendered from its kind's field descriptions (model/kinds.ts `fieldsOf`, each kind's
 * own in model/items/). Fields are not memoised: each render binds every field's callbacks to this item,
 * and an edit is applied to the item as it is in the store when the edit lands.
 */
function ItemFields({ item, units }: { item: Item; units: Units }) {
  const update = useUpdate(item.id);
  return <FieldList fields={fieldsOf(item)} item={item} units={units} update={update} />;
}

function FieldList({ fields, item, units, update }: { fields: readonly FieldSpec<Item>[]; item: Item; units: Units; update: (p: Patch) => void }) {
  return <>{fields.map((f) => (f.when && !f.when(item) ? null : <Field key={`${fieldLabel(f, units)}·${f.type}`} field={f} item={item} units={units} update={update} />))}</>;
}

function Field({ field: f, item, units, update }: { field: FieldSpec<Item>; item: Item; units: Units; update: (p: Patch) => void }) {
  const stage = useEditor((s) => s.doc.stage);
  const ctx: FieldContext = { stage };
  switch (f.type) {
    case 'number': {
      const step = f.step;
      return (
        <NumberField
          label={fieldLabel(f, units)}
          value={f.get(item)}
          format={(v) => f.format(v, units)}
          parse={(t) => f.parse(t, units)}
          range={rangeOf(f, ctx)}
          blankOk={f.blankOk}
          onCommit={(v) => update((i) => f.set(v, i))}
          onStep={step ? (d) => update((i) => step(i, d, ctx)) : undefined}
          testID={f.testID}
        />
      );
    }
    case 'choice':
      return <ChoiceField label={f.label} value={f.get(item)} options={[...f.options]} onChange={(v) => update((i) => f.set(v, i))} />;
    case 'switch':
      return <SwitchField label={f.label} value={f.get(item)} onChange={(v) => update((i) => f.set(v, i))} />;
    case 'text':
      return <TextField label={f.label} value={f.get(item)} onCommit={(v) => update((i) => f.set(v, i))} multiline={f.multiline} />;
    case 'reading':
      return <ReadingField field={f} item={item} units={units} update={update} />;
    case 'section':
      return (
        <View style={s.box}>
          <Text style={s.sub}>{f.label}</Text>
          <FieldList fields={f.fields} item={item} units={units} update={update} />
        </View>
      );
  }
}

/** A light's meter reading: a form that changes the light only when confirmed (or cleared). */
function ReadingField({ field: f, item, units, update }: { field: ReadingFieldSpec<Item>; item: Item; units: Units; update: (p: Patch) => void }) {
  const store = useEditorApi();
  const readOnly = useEditor((s) => s.readOnly);
  return (
    <ReadingForm
      label={f.label}
      value={f.get(item)}
      units={units}
      needsShutter={f.needsShutter(item)}
      powerNow={f.powerNow(item)}
      readOnly={readOnly}
      start={() => readingStart(store.getState().doc.items, item)}
      onSave={(v) => update((i) => f.set(v, i))}
    />
  );
}

/** A new reading starts at the camera's ISO and shutter and the light's distance to the subject (when there is one). */
function readingStart(items: readonly Item[], light: Item): ReadingStart {
  const camera = items.find((i) => i.kind === 'camera') as ItemOf<'camera'> | undefined;
  const subject = items.find((i) => i.kind === 'subject') as ItemOf<'subject'> | undefined;
  const l = light as ItemOf<'light'>;
  const distanceM = subject && light.kind === 'light' ? Math.round(Math.hypot(subject.x - l.x, subject.y - l.y, subject.faceHeightM - l.heightM) * 100) / 100 : null;
  return { iso: camera?.iso ?? 100, shutterS: camera?.shutterS ?? 1 / 125, distanceM: distanceM !== null && distanceM >= 0.05 ? distanceM : null };
}

const s = StyleSheet.create({
  wrap: { padding: space.lg },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18, marginBottom: space.md },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14, marginBottom: space.sm },
  box: { borderTopWidth: 1, borderTopColor: colours.line, paddingTop: space.md, marginTop: space.sm },
  actions: { flexDirection: 'row', gap: space.sm, marginBottom: space.md, flexWrap: 'wrap' },
  action: { minHeight: 44, paddingHorizontal: space.md, borderRadius: 8, borderWidth: 1, borderColor: colours.line, justifyContent: 'center' },
  actionText: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 13 },
});
