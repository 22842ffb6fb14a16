// The setup editor. Phone: the plan fills the screen, kit behind one button, readings and settings in a
// bottom sheet. Wide (≥ 1024 px): kit and steps on the left, the plan in the middle, item and meter right.
import { useRouter } from 'expo-router';
import { useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import { Modal, Platform, Pressable, ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { PlanCanvas } from '../../canvas/PlanCanvas';
import { useReadings } from '../../canvas/readings';
import { handleKey } from '../../canvas/state/keys';
import { EditorContext, createEditorStore, useEditor, type EditorStore } from '../../canvas/state/store';
import { graphiteTheme } from '../../canvas/views';
import { WIDE_MIN, colours, fonts, space } from '../../constants/theme';
import { saveStateLabel, useSetupSync, type ServerSetup } from '../../hooks/useSetupSync';
import { itemsAtStep } from '../../model/scene';
import type { ItemOf } from '../../model/document';
import { formatAperture, formatStops, type Units } from '../../model/units';
import { Button } from '../ui';
import { CrewSheetPanel } from '../crew/CrewSheetPanel';
import { PhotosPanel } from '../photos/PhotosPanel';
import { BottomSheet, PEEK_PX } from './BottomSheet';
import { Inspector } from './Inspector';
import { MeterPanel } from './MeterPanel';
import { Palette } from './Palette';
import { ShotsPanel } from './ShotsPanel';
import { StepsPanel } from './StepsPanel';
import { TextField } from './fields';

type Tab = 'meter' | 'item' | 'steps' | 'shots' | 'crew' | 'notes';
const tabs: { id: Tab; label: string }[] = [
  { id: 'meter', label: 'Meter' },
  { id: 'item', label: 'Item' },
  { id: 'steps', label: 'Steps' },
  { id: 'shots', label: 'Shots' },
  { id: 'crew', label: 'Crew' },
  { id: 'notes', label: 'Notes' },
];

export function EditorScreen({ setup, units }: { setup: ServerSetup; units: Units }) {
  const readOnly = setup.role === 'crew';
  const store = useMemo(() => createEditorStore(setup.document, { readOnly }), [setup.id]); // eslint-disable-line react-hooks/exhaustive-deps
  return (
    <EditorContext.Provider value={store}>
      <Editor setup={setup} store={store} units={units} readOnly={readOnly} />
    </EditorContext.Provider>
  );
}

function Editor({ setup, store, units, readOnly }: { setup: ServerSetup; store: EditorStore; units: Units; readOnly: boolean }) {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_MIN;
  const doc = useEditor((s) => s.doc);
  const canUndo = useEditor((s) => s.past.length > 0);
  const canRedo = useEditor((s) => s.future.length > 0);
  const snap = useEditor((s) => s.snap);
  const drawingWall = useEditor((s) => s.tool === 'wall');
  // The falloff chart follows the selection at low priority, like the inspector.
  const selectedLight = useDeferredValue(
    useEditor((s) => {
      const i = s.selection.length === 1 ? s.doc.items.find((x) => x.id === s.selection[0]) : undefined;
      return i?.kind === 'light' ? (i as ItemOf<'light'>) : null;
    }),
  );
  const [showMap, setShowMap] = useState(true);
  const [step, setStep] = useState<number | null>(null);
  const [tab, setTab] = useState<Tab>('meter');
  const [kitOpen, setKitOpen] = useState(false);
  const [title, setTitle] = useState(setup.title);
  const [notes, setNotes] = useState(setup.notes);
  const readings = useReadings(doc, { lightMap: showMap, stepIndex: step ?? undefined });
  const sync = useSetupSync(setup);

  // Autosave every document change.
  const lastDoc = useRef(doc);
  useEffect(() => {
    if (doc === lastDoc.current) return;
    lastDoc.current = doc;
    if (!readOnly) sync.save({ document: doc });
  }, [doc, readOnly, sync]);

  // Keyboard shortcuts on the web (not while typing in a field).
  const keys = useRef({ space: false, shift: false });
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof window === 'undefined') return;
    const typing = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      return !!t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.isContentEditable);
    };
    const down = (e: KeyboardEvent) => {
      keys.current.shift = e.shiftKey;
      if (typing(e)) return;
      if (e.key === ' ') {
        keys.current.space = true;
        e.preventDefault();
        return;
      }
      if (handleKey(store, e)) e.preventDefault();
    };
    const up = (e: KeyboardEvent) => {
      keys.current.shift = e.shiftKey;
      if (e.key === ' ') keys.current.space = false;
    };
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    return () => {
      window.removeEventListener('keydown', down);
      window.removeEventListener('keyup', up);
    };
  }, [store]);

  const visible = useMemo(() => (step === null ? null : new Set(itemsAtStep(doc, step).map((i) => i.id))), [doc, step]);
  const saveLabel = readOnly ? 'Read only' : saveStateLabel(sync.state);

  const topBar = (
    <View style={s.topBar}>
      <Pressable accessibilityRole="link" accessibilityLabel="Back to setups" onPress={() => router.navigate('/setups')} style={s.back}>
        <Text style={s.backText}>‹</Text>
      </Pressable>
      <View style={{ flex: 1 }}>
        <Text style={s.title} numberOfLines={1}>
          {title}
        </Text>
        <Text numberOfLines={1} style={[s.saveState, sync.state.kind === 'offline' || sync.state.kind === 'failed' ? { color: colours.danger } : null]} testID="save-state" accessibilityLiveRegion="polite">
          {saveLabel}
        </Text>
      </View>
      {!readOnly ? (
        <>
          <IconButton label="Undo" text="↶" disabled={!canUndo} onPress={() => store.dispatch('undo')} />
          <IconButton label="Redo" text="↷" disabled={!canRedo} onPress={() => store.dispatch('redo')} />
        </>
      ) : null}
      {!wide && !readOnly ? <IconButton label="Open the kit" text="+" onPress={() => setKitOpen(true)} /> : null}
    </View>
  );

  const panel = (t: Tab) => {
    switch (t) {
      case 'meter':
        return <MeterPanel readings={readings} doc={doc} selectedLight={selectedLight} units={units} />;
      case 'item':
        return <Inspector units={units} />;
      case 'steps':
        return <StepsPanel activeStep={step} onShowStep={setStep} />;
      case 'shots':
        return <ShotsPanel />;
      case 'crew':
        return <CrewSheetPanel setupId={setup.id} />;
      case 'notes':
        return (
          <>
            <View style={{ padding: space.lg }}>
              <TextField label="Title" value={title} onCommit={(v) => { if (!readOnly && v.trim()) { setTitle(v.trim()); sync.save({ title: v.trim() }); } }} />
              <TextField label="Notes" value={notes} multiline onCommit={(v) => { if (!readOnly) { setNotes(v); sync.save({ notes: v }); } }} />
            </View>
            <PhotosPanel setupId={setup.id} predictedAperture={readings.meter?.subject.aperture ?? null} />
          </>
        );
    }
  };

  const viewToggles = useMemo(
    () => (
      <>
        <IconButton label={showMap ? 'Hide the light map' : 'Show the light map'} text="◐" active={showMap} onPress={() => setShowMap((v) => !v)} />
        {!readOnly ? <IconButton label={snap ? 'Snapping on' : 'Snapping off'} text="#" active={snap} onPress={() => store.dispatch('toggleSnap')} /> : null}
      </>
    ),
    [showMap, snap, readOnly, store],
  );

  const canvas = (
    <PlanCanvas theme={graphiteTheme} visibleIds={visible} units={units} lightMap={showMap ? readings.map : null} boxSelect={wide} keys={keys} insetBottom={wide ? 0 : PEEK_PX} controls={viewToggles} testID="plan" />
  );

  const conflict =
    sync.state.kind === 'conflict' ? (
      <ConflictNotice
        mine={{ title, at: new Date() }}
        theirs={sync.state.theirs}
        onTakeTheirs={() => {
          const theirs = (sync.state as { theirs: ServerSetup }).theirs;
          sync.acceptTheirs(theirs);
          lastDoc.current = theirs.document;
          store.load(theirs.document);
          setTitle(theirs.title);
          setNotes(theirs.notes);
        }}
        onKeepMine={async () => {
          const copy = await sync.keepMineAsCopy(store.getState().doc, title);
          router.replace(`/setups/${copy.id}`);
        }}
      />
    ) : null;

  if (wide) {
    return (
      <View style={s.root}>
        {topBar}
        {conflict}
        <View style={s.columns}>
          <ScrollView style={s.left}>
            <Palette />
            <StepsPanel activeStep={step} onShowStep={setStep} />
            <ShotsPanel />
          </ScrollView>
          <View style={s.centre}>
            {canvas}
            {drawingWall ? <Text style={s.hint}>Drag on the plan from one end of the wall to the other.</Text> : null}
          </View>
          <ScrollView style={s.right}>
            <Inspector units={units} />
            <MeterPanel readings={readings} doc={doc} selectedLight={selectedLight} units={units} />
            {panel('crew')}
            {panel('notes')}
          </ScrollView>
        </View>
      </View>
    );
  }

  const m = readings.meter;
  return (
    <View style={s.root}>
      {topBar}
      {conflict}
      <View style={{ flex: 1 }}>
        {canvas}
        {drawingWall ? <Text style={s.hint}>Drag on the plan from one end of the wall to the other.</Text> : null}
        <BottomSheet
          header={
            <>
              <Text style={s.peek} testID="meter-peek" accessibilityLiveRegion="polite">
                {m ? `Subject ${formatAperture(m.subject.aperture)} (${formatStops(m.subject.stopsVsCamera)})${m.background?.stopsVsSubject != null ? ` · background ${formatStops(m.background.stopsVsSubject)}` : ''}` : readings.build.missing.length ? `Add ${readings.build.missing.join(' and ')}` : '—'}
              </Text>
              <View style={s.tabs} role="tablist">
                {tabs.map((t) => (
                  <Pressable key={t.id} role="tab" accessibilityState={{ selected: tab === t.id }} accessibilityLabel={t.label} onPress={() => setTab(t.id)} style={[s.tab, tab === t.id && s.tabOn]}>
                    <Text style={[s.tabText, tab === t.id && { color: colours.accent }]}>{t.label}</Text>
                  </Pressable>
                ))}
              </View>
            </>
          }
        >
          <ScrollView contentContainerStyle={{ paddingBottom: 40 }}>{panel(tab)}</ScrollView>
        </BottomSheet>
      </View>
      <Modal visible={kitOpen} transparent animationType="slide" onRequestClose={() => setKitOpen(false)}>
        <Pressable style={s.scrim} onPress={() => setKitOpen(false)} accessibilityLabel="Close the kit" />
        <View style={s.kitSheet}>
          <ScrollView>
            <Palette
              onAdded={() => {
                setKitOpen(false);
                setTab('item');
              }}
            />
          </ScrollView>
        </View>
      </Modal>
    </View>
  );
}

function IconButton({ label, text, onPress, disabled, active }: { label: string; text: string; onPress: () => void; disabled?: boolean; active?: boolean }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} accessibilityState={{ disabled, selected: active }} disabled={disabled} onPress={onPress} style={[s.icon, active && { borderColor: colours.accent }, disabled && { opacity: 0.35 }]}>
      <Text style={[s.iconText, active && { color: colours.accent }]}>{text}</Text>
    </Pressable>
  );
}

function ConflictNotice({ mine, theirs, onTakeTheirs, onKeepMine }: { mine: { title: string; at: Date }; theirs: ServerSetup; onTakeTheirs: () => void; onKeepMine: () => void }) {
  return (
    <View style={s.conflict} accessibilityRole="alert">
      <Text style={s.conflictTitle}>This setup was changed somewhere else while you worked.</Text>
      <Text style={s.conflictText}>
        Theirs: “{theirs.title}”, saved {new Date(theirs.updatedAt).toLocaleString()}. Yours: “{mine.title}”, changed {mine.at.toLocaleTimeString()}.
      </Text>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label="Keep mine as a copy" onPress={onKeepMine} />
        <Button kind="quiet" label="Load theirs" onPress={onTakeTheirs} />
      </View>
    </View>
  );
}

const s = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  // A fixed height: the plan below must not jump when the save state's text changes mid-drag.
  topBar: { height: 54, flexDirection: 'row', alignItems: 'center', gap: 6, paddingHorizontal: space.sm, backgroundColor: colours.panel, borderBottomWidth: 1, borderBottomColor: colours.line },
  back: { width: 40, height: 40, alignItems: 'center', justifyContent: 'center' },
  backText: { color: colours.text, fontSize: 30, lineHeight: 32 },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 16 },
  saveState: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 11 },
  icon: { width: 40, height: 40, borderRadius: 8, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center', backgroundColor: '#26292ecc' },
  iconText: { color: colours.text, fontSize: 18, fontFamily: fonts.sansMedium },
  columns: { flex: 1, flexDirection: 'row' },
  left: { width: 300, flexGrow: 0, borderRightWidth: 1, borderRightColor: colours.line, backgroundColor: colours.panel },
  centre: { flex: 1 },
  right: { width: 340, flexGrow: 0, borderLeftWidth: 1, borderLeftColor: colours.line, backgroundColor: colours.panel },
  peek: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 14, paddingHorizontal: space.lg, marginBottom: 6 },
  tabs: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colours.line },
  tab: { flex: 1, alignItems: 'center', paddingVertical: 10, minHeight: 44 },
  tabOn: { borderBottomWidth: 2, borderBottomColor: colours.accent },
  tabText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13 },
  scrim: { flex: 1, backgroundColor: '#0008' },
  hint: { position: 'absolute', top: 12, left: 12, right: 60, color: colours.accentText, backgroundColor: colours.accent, fontFamily: fonts.sansMedium, fontSize: 13, padding: space.sm, borderRadius: 8 },
  kitSheet: { maxHeight: '70%', backgroundColor: colours.panel, borderTopLeftRadius: 16, borderTopRightRadius: 16 },
  conflict: { backgroundColor: '#3a2a1c', borderBottomWidth: 1, borderBottomColor: colours.accent, padding: space.md, gap: space.sm },
  conflictTitle: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 15 },
  conflictText: { color: colours.text, fontFamily: fonts.sans, fontSize: 13 },
});
