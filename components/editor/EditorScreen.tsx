// The setup editor. Phone: the plan fills the screen, kit behind one button, readings and settings in a
// bottom sheet. Wide (≥ 1024 px): kit and steps on the left, the plan in the middle, item and meter right.
// The screen composes; the editor object (canvas/editor) owns the plan, autosave (persist) and the meter
// run beside it outside React, and each part below subscribes to just what it shows.
import { useQueryClient } from '@tanstack/react-query';
import { useLocalSearchParams, useRouter } from 'expo-router';
import { memo, useEffect, useMemo, useRef, useState } from 'react';
import { Modal, Platform, Pressable, ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { useStore } from 'zustand';
import { PlanCanvas, type LightMapSource } from '../../canvas/PlanCanvas';
import { createEditor, type Editor } from '../../canvas/editor/editor';
import { liveItem } from '../../canvas/editor/state';
import { attachToPage, createPersist, saveStatusLabel, type Persist } from '../../canvas/editor/persist';
import { EditorContext, PANEL_PACE_MS, afterPaint, useEditor, useEditorApi, usePaced } from '../../canvas/editor/react';
import { createMeter, meterSettled, type Meter } from '../../canvas/meter/meter';
import { graphiteTheme } from '../../canvas/views';
import { WIDE_MIN, colours, fonts, space } from '../../constants/theme';
import { confirmLeave, unsentMessage, useLeaveGuard } from '../../hooks/leaveGuard';
import { isOnlineNow, useOnline } from '../../hooks/offline';
import { offlineQueue } from '../../hooks/offlineQueue';
import { persistCacheHooks, persistClient } from '../../hooks/persistClient';
import type { SetupDetail } from '../../model/api';
import { itemsAtStep } from '../../model/documentToScene';
import { formatAperture, formatStops, lengthText, type Units } from '../../model/units';
import { ErrorBoundary } from '../ErrorBoundary';
import { Button } from '../ui';
import { CommentsPanel } from '../comments/CommentsPanel';
import { CrewSheetPanel } from '../crew/CrewSheetPanel';
import { EditorFrame } from '../frame/EditorFrame';
import { PhotosPanel } from '../photos/PhotosPanel';
import { SideView } from '../side/SideView';
import { BottomSheet, PEEK_PX, type SheetRequest } from './BottomSheet';
import { LiveMeterPanel, LiveSuggestedPower } from './LiveMeter';
import { METER_READING } from './MeterPanel';
import { Inspector } from './Inspector';
import { KitAtHand } from './KitAtHand';
import { Palette } from './Palette';
import { SetupSettings } from './SetupSettings';
import { ShotsPanel } from './ShotsPanel';
import { StepsPanel } from './StepsPanel';
import { TextField } from './fields';
import { formatDateTime, formatTime } from '../../model/format';
import { usePageTitle } from '../../hooks/pageTitle';
import { SkipLink } from '../SkipLink';
import { useFocusAfterDelete } from './focusAfterDelete';

// The phone's sheet: six tabs as a photographer works — the item in hand, the meter, the frame, the heights,
// the setup as a whole (its room, steps, shots, notes and crew sheet, one tap further) and the talk on it.
type Tab = 'item' | 'meter' | 'frame' | 'side' | 'setup' | 'talk';
const tabs: { id: Tab; label: string }[] = [
  { id: 'item', label: 'Item' },
  { id: 'meter', label: 'Meter' },
  { id: 'frame', label: 'Frame' },
  { id: 'side', label: 'Side' },
  { id: 'setup', label: 'Setup' },
  { id: 'talk', label: 'Talk' },
];
type SetupPart = 'room' | 'steps' | 'shots' | 'notes' | 'crew';
const setupParts: { id: SetupPart; label: string }[] = [
  { id: 'room', label: 'Room' },
  { id: 'steps', label: 'Steps' },
  { id: 'shots', label: 'Shots' },
  { id: 'notes', label: 'Notes' },
  { id: 'crew', label: 'Crew sheet' },
];

type Parts = { editor: Editor; persist: Persist; meter: Meter };

/** The editor, its autosave and its meter for one setup: made once per setup, disposed on leaving. */
function useEditorParts(setup: SetupDetail, readOnly: boolean): Parts {
  const qc = useQueryClient();
  const parts = useMemo(() => {
    const editor = createEditor(setup.document, { readOnly, title: setup.title, notes: setup.notes });
    const storage = Platform.OS === 'web' && typeof localStorage !== 'undefined' ? localStorage : null;
    const web = Platform.OS === 'web';
    const persist = createPersist(editor, { setup, client: persistClient, storage, queue: web ? offlineQueue : null, isOnline: isOnlineNow, ...persistCacheHooks(qc, setup.id) });
    const meter = createMeter(editor, { lightMap: true });
    // No reading is computed in this render. A worker (started by the route) is asked now, while the page
    // renders; the page itself computes the numbers after the first paint (below), unless the worker has
    // answered by then (on a slow line its script arrives after the page has painted).
    if (meter.engine.kind === 'worker') meter.start();
    return { editor, persist, meter };
  }, [setup.id]); // eslint-disable-line react-hooks/exhaustive-deps
  useEffect(() => {
    const detach = typeof window !== 'undefined' && typeof window.addEventListener === 'function' ? attachToPage(parts.persist) : () => {};
    const cancelStart = afterPaint(() => {
      parts.meter.readFirst();
      parts.meter.start();
    });
    return () => {
      cancelStart();
      detach();
      parts.persist.dispose();
      parts.meter.dispose();
    };
  }, [parts]);
  return parts;
}

export function EditorScreen({ setup, units }: { setup: SetupDetail; units: Units }) {
  const router = useRouter();
  const readOnly = setup.role === 'crew';
  const parts = useEditorParts(setup, readOnly);
  return (
    <EditorContext.Provider value={parts.editor}>
      <ErrorBoundary what="the editor" onLeave={() => router.navigate('/setups')}>
        <EditorBody parts={parts} units={units} readOnly={readOnly} setupId={setup.id} />
      </ErrorBoundary>
    </EditorContext.Provider>
  );
}

/** Keyboard shortcuts on the web (not while typing in a field): the editor's one key map. */
function useKeyboard(editor: Editor) {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof window === 'undefined') return;
    const typing = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      return !!t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.isContentEditable);
    };
    const down = (e: KeyboardEvent) => {
      if (typing(e)) {
        editor.dispatch('setInput', { shift: e.shiftKey });
        return;
      }
      if (editor.keys.down(e)) e.preventDefault();
    };
    const up = (e: KeyboardEvent) => editor.keys.up(e);
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    return () => {
      window.removeEventListener('keydown', down);
      window.removeEventListener('keyup', up);
    };
  }, [editor]);
}

function EditorBody({ parts, units, readOnly, setupId }: { parts: Parts; units: Units; readOnly: boolean; setupId: string }) {
  const { editor, persist, meter } = parts;
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_MIN;
  const snap = useEditor((s) => s.snap);
  const drawingWall = useEditor((s) => s.tool === 'wall');
  const [showMap, setShowMap] = useState(true);
  const [step, setStep] = useState<number | null>(null);
  const params = useLocalSearchParams<{ panel?: string }>();
  const [tab, setTab] = useState<Tab>(params.panel === 'comments' ? 'talk' : 'meter');
  const [setupPart, setSetupPart] = useState<SetupPart>('room');
  const [kitOpen, setKitOpen] = useState(false);
  // The phone's sheet: its height (the plan fits above it) and the stop the screen asks it for.
  const [sheetH, setSheetH] = useState(PEEK_PX);
  const [sheetRequest, setSheetRequest] = useState<SheetRequest | null>(null);
  useKeyboard(editor);
  useFocusAfterDelete(editor);
  // Showing a tab's content: the sheet rises to half height when it rests lower (never lowered).
  const showTab = (t: Tab) => {
    setTab(t);
    setSheetRequest((r) => ({ stop: 1, n: (r?.n ?? 0) + 1 }));
  };
  const openItem = () => showTab('item');
  // An item added from the kit opens its settings; drawing a wall keeps the plan clear for the drag.
  const onKitAdded = () => {
    if (editor.getState().tool !== 'wall') openItem();
  };
  useOpenRequests(editor, !wide, openItem);

  useEffect(() => editor.dispatch('setInput', { boxSelect: wide }), [editor, wide]);
  useEffect(() => meter.setOptions({ lightMap: showMap }), [meter, showMap]);
  // A step view shows the plan as it stands at that step; the meter reads the same.
  useEffect(() => {
    const doc = editor.getState().doc;
    editor.dispatch('setVisible', { ids: step === null ? null : new Set(itemsAtStep(doc, step).map((i) => i.id)) });
    meter.setOptions({ stepIndex: step ?? undefined });
  }, [editor, meter, step]);

  const viewToggles = useMemo(
    () => (
      <>
        <IconButton label={showMap ? 'Hide the light map' : 'Show the light map'} text="◐" active={showMap} onPress={() => setShowMap((v) => !v)} />
        {!readOnly ? <IconButton label={snap ? 'Snapping on' : 'Snapping off'} text="#" active={snap} onPress={() => editor.dispatch('toggleSnap')} /> : null}
      </>
    ),
    [showMap, snap, readOnly, editor],
  );

  const canvas = (
    <ErrorBoundary what="the plan" compact>
      <LiveCanvas meter={meter} units={units} insetBottom={wide ? 0 : sheetH} controls={viewToggles} />
    </ErrorBoundary>
  );
  // A phone's sheet at its peek shows its header only: the panels below it hold through a drag.
  const offscreen = !wide && sheetH <= PEEK_PX + 1;
  const meterPanel = <LiveMeterPanel meter={meter} units={units} offscreen={offscreen} />;
  const notes = (
    <>
      <NotesFields readOnly={readOnly} />
      <LivePhotos meter={meter} setupId={setupId} />
    </>
  );
  const sections: Record<SetupPart, () => React.ReactNode> = {
    room: () => <SetupSettings units={units} />,
    steps: () => <StepsPanel activeStep={step} onShowStep={setStep} />,
    shots: () => <ShotsPanel />,
    notes: () => notes,
    crew: () => <CrewSheetPanel setupId={setupId} />,
  };
  const panel = (t: Tab) => {
    switch (t) {
      case 'meter':
        return meterPanel;
      case 'frame':
        return <EditorFrame stepIndex={step ?? undefined} wide={wide} readOnly={readOnly} offscreen={offscreen} />;
      case 'item':
        return (
          <>
            <LiveSuggestedPower meter={meter} />
            <Inspector units={units} />
          </>
        );
      case 'side':
        return <SideView units={units} />;
      case 'setup':
        return (
          <>
            <View style={s.parts} role="tablist" accessibilityLabel="Parts of the setup">
              {setupParts.map((p) => (
                <Pressable key={p.id} role="tab" accessibilityState={{ selected: setupPart === p.id }} aria-selected={setupPart === p.id} accessibilityLabel={p.label} onPress={() => setSetupPart(p.id)} style={[s.part, setupPart === p.id && s.partOn]}>
                  <Text style={[s.partText, setupPart === p.id && { color: colours.accent }]}>{p.label}</Text>
                </Pressable>
              ))}
            </View>
            {sections[setupPart]()}
          </>
        );
      case 'talk':
        return <CommentsPanel setupId={setupId} units={units} canWrite={!readOnly} />;
    }
  };
  const topBar = <TopBar persist={persist} readOnly={readOnly} wide={wide} onOpenKit={() => setKitOpen(true)} />;
  const notices = (
    <>
      <ConflictNotice persist={persist} />
      <KeptNotice persist={persist} />
    </>
  );
  const hint = drawingWall ? <WallHint units={units} /> : null;

  if (wide) {
    return (
      <View style={s.root}>
        <SkipLink />
        {topBar}
        {notices}
        <View style={s.columns}>
          <ScrollView style={s.left}>
            <Palette />
            <SetupSettings units={units} />
            <StepsPanel activeStep={step} onShowStep={setStep} />
            <ShotsPanel />
          </ScrollView>
          <View style={s.centre}>
            <View style={s.kitBar}>
              <KitAtHand testID="kit-at-hand" />
            </View>
            <View style={{ flex: 1 }}>
              {canvas}
              {hint}
            </View>
            <View style={s.sidePane}>
              <SideView units={units} height={200} />
            </View>
          </View>
          <ScrollView style={s.right}>
            <LiveSuggestedPower meter={meter} />
            <Inspector units={units} />
            {panel('frame')}
            {meterPanel}
            {sections.crew()}
            {notes}
            {panel('talk')}
          </ScrollView>
        </View>
      </View>
    );
  }

  return (
    <View style={s.root}>
      <SkipLink />
      {topBar}
      {notices}
      <View style={{ flex: 1 }}>
        {canvas}
        {hint}
        <BottomSheet
          request={sheetRequest}
          onHeight={setSheetH}
          header={
            <>
              <View style={s.sheetKit}>
                <KitAtHand onAdded={onKitAdded} testID="kit-at-hand" />
              </View>
              <MeterPeek meter={meter} />
              <View style={s.tabs} role="tablist">
                {tabs.map((t) => (
                  <Pressable key={t.id} role="tab" accessibilityState={{ selected: tab === t.id }} aria-selected={tab === t.id} accessibilityLabel={t.label} onPress={() => showTab(t.id)} style={[s.tab, tab === t.id && s.tabOn]}>
                    <Text style={[s.tabText, tab === t.id && { color: colours.accent }]}>{t.label}</Text>
                  </Pressable>
                ))}
              </View>
            </>
          }
        >
          {/* A focus stop of its own, so a keyboard can scroll the panel (WCAG 2.1.1). Keyed by the tab: each tab
              opens at its top (a scroll kept from a longer tab hid the frame's top and the item's name). */}
          <ScrollView key={tab} contentContainerStyle={{ paddingBottom: 40 }} role="tabpanel" aria-label={tabs.find((t) => t.id === tab)?.label} tabIndex={0}>
            {panel(tab)}
          </ScrollView>
        </BottomSheet>
      </View>
      <Modal visible={kitOpen} transparent animationType="slide" onRequestClose={() => setKitOpen(false)}>
        <Pressable style={s.scrim} onPress={() => setKitOpen(false)} accessibilityLabel="Close the kit" />
        <View style={s.kitSheet}>
          <ScrollView>
            <Palette
              onAdded={() => {
                setKitOpen(false);
                // A new item is a choice made by name: its settings open.
                onKitAdded();
              }}
            />
          </ScrollView>
        </View>
      </Modal>
    </View>
  );
}

/** While the wall tool is chosen: what to do, and once the drag is under way the wall's length as it is drawn
 *  (the live wall from the drag slice; this small line is all that re-renders per move). */
function WallHint({ units }: { units: Units }) {
  const lengthM = useEditor((st) => {
    if (st.tool !== 'wall' || !st.gesture || !st.selection[0]) return null;
    const w = liveItem(st, st.selection[0]);
    return w && w.kind === 'wall' ? Math.hypot(w.b.x - w.a.x, w.b.y - w.a.y) : null;
  });
  if (lengthM === null) return <Text style={s.hint}>Drag on the plan from one end of the wall to the other.</Text>;
  return (
    <Text style={s.hint} testID="wall-length" accessibilityLiveRegion="polite">
      Wall {lengthText(lengthM, units)}
      {units === 'metric' ? ' m' : ''}
    </Text>
  );
}

/** On a phone, only a deliberate choice of one item (a tap on it, or picking it by name) opens its settings;
 *  a selection from a drag, an undo, a box or the program leaves the sheet's tab alone. */
function useOpenRequests(editor: Editor, enabled: boolean, open: () => void) {
  const openRef = useRef(open);
  openRef.current = open;
  useEffect(() => (enabled ? editor.opens.subscribe(() => openRef.current()) : undefined), [editor, enabled]);
}

/** The plan with the meter's light map: only the map's layers re-render when a new map arrives, at the
 *  meter's pace (not the plan). */
const LiveCanvas = memo(function LiveCanvas({ meter, units, insetBottom, controls }: { meter: Meter; units: Units; insetBottom: number; controls: React.ReactNode }) {
  const map = useMemo<LightMapSource>(
    () => ({
      get: () => meter.getState().readings?.map ?? null,
      subscribe: (onChange) => meter.subscribe((m, prev) => m.readings?.map !== prev.readings?.map && onChange()),
    }),
    [meter],
  );
  return <PlanCanvas theme={graphiteTheme} units={units} lightMap={map} insetBottom={insetBottom} controls={controls} testID="plan" />;
});

/** The phone's one line of the meter. Until the first reading: says the meter is still reading (no number, and
 *  not "—", which means no light on the subject). */
function MeterPeek({ meter }: { meter: Meter }) {
  const readings = usePaced(meter, (m) => m.readings, PANEL_PACE_MS, meterSettled);
  const m = readings?.meter;
  return (
    <Text style={s.peek} testID="meter-peek" accessibilityLiveRegion="polite">
      {!readings ? METER_READING : m ? `Subject ${formatAperture(m.subject.aperture)} (${formatStops(m.subject.stopsVsCamera)})${m.background?.stopsVsSubject != null ? ` · background ${formatStops(m.background.stopsVsSubject)}` : ''}` : readings.build.missing.length ? `Add ${readings.build.missing.join(' and ')}` : '—'}
    </Text>
  );
}

function LivePhotos({ meter, setupId }: { meter: Meter; setupId: string }) {
  const aperture = usePaced(meter, (m) => m.readings?.meter?.subject.aperture ?? null, PANEL_PACE_MS, meterSettled);
  return <PhotosPanel setupId={setupId} predictedAperture={aperture} />;
}

function NotesFields({ readOnly }: { readOnly: boolean }) {
  const editor = useEditorApi();
  const title = useEditor((s) => s.meta.title);
  const notes = useEditor((s) => s.meta.notes);
  return (
    <View style={{ padding: space.lg }}>
      <TextField label="Title" value={title} onCommit={(v) => !readOnly && v.trim() && editor.dispatch('setMeta', { title: v.trim() })} />
      <TextField label="Notes" value={notes} multiline onCommit={(v) => !readOnly && editor.dispatch('setMeta', { notes: v })} />
    </View>
  );
}

function TopBar({ persist, readOnly, wide, onOpenKit }: { persist: Persist; readOnly: boolean; wide: boolean; onOpenKit: () => void }) {
  const router = useRouter();
  const editor = useEditorApi();
  const title = useEditor((s) => s.meta.title);
  usePageTitle(title);
  const canUndo = useEditor((s) => s.past.length > 0);
  const canRedo = useEditor((s) => s.future.length > 0);
  const status = useStore(persist, (p) => p.status);
  const waiting = useStore(persist, (p) => p.waiting);
  const online = useOnline();
  // Edits still on this device: leaving (the back button, a reload, closing the tab) asks first.
  useLeaveGuard(() => unsentMessage(persist.getState().waiting));
  const saveLabel = readOnly ? (online ? 'Read only' : 'Read only · offline') : !online && status.kind === 'saved' ? 'Offline — nothing waiting' : saveStatusLabel(status, waiting);
  return (
    <View style={s.topBar}>
      <Pressable accessibilityRole="link" accessibilityLabel="Back to setups" onPress={() => confirmLeave() && router.navigate('/setups')} style={s.back}>
        <Text style={s.backText}>‹</Text>
      </Pressable>
      <View style={{ flex: 1 }}>
        <Text style={s.title} numberOfLines={1} role="heading" aria-level={1}>
          {title}
        </Text>
        <Text numberOfLines={1} style={[s.saveState, status.kind === 'offline' || status.kind === 'failed' || waiting > 0 ? { color: colours.danger } : null]} testID="save-state" accessibilityLiveRegion="polite">
          {saveLabel}
        </Text>
      </View>
      {!readOnly ? (
        <>
          <IconButton label="Undo" text="↶" disabled={!canUndo} onPress={() => editor.dispatch('undo')} />
          <IconButton label="Redo" text="↷" disabled={!canRedo} onPress={() => editor.dispatch('redo')} />
        </>
      ) : null}
      {!wide && !readOnly ? <IconButton label="Open the kit" text="+" onPress={onOpenKit} /> : null}
    </View>
  );
}

function IconButton({ label, text, onPress, disabled, active }: { label: string; text: string; onPress: () => void; disabled?: boolean; active?: boolean }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={label} accessibilityState={{ disabled, selected: active }} aria-pressed={active === undefined ? undefined : active} disabled={disabled} onPress={onPress} style={[s.icon, active && { borderColor: colours.accent }, disabled && { opacity: 0.35 }]}>
      <Text style={[s.iconText, active && { color: colours.accent }]}>{text}</Text>
    </Pressable>
  );
}

function ConflictNotice({ persist }: { persist: Persist }) {
  const router = useRouter();
  const status = useStore(persist, (p) => p.status);
  const title = useEditor((s) => s.meta.title);
  const [at] = useState(() => new Date());
  if (status.kind !== 'conflict') return null;
  const theirs = status.theirs;
  return (
    <View style={s.conflict} accessibilityRole="alert">
      <Text style={s.conflictTitle}>This setup was changed somewhere else while you worked.</Text>
      <Text style={s.conflictText}>
        Theirs: “{theirs.title}”, saved {formatDateTime(theirs.updatedAt)}. Yours: “{title}”, changed {formatTime(at)}.
      </Text>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button
          label="Keep mine as a copy"
          onPress={async () => {
            const copy = await persist.keepMineAsCopy();
            router.replace(`/setups/${copy.id}`);
          }}
        />
        <Button kind="quiet" label="Load theirs" onPress={() => persist.loadTheirs()} />
      </View>
    </View>
  );
}

/** Changes sent as the page closed last time that never arrived: say so, and offer them back. */
function KeptNotice({ persist }: { persist: Persist }) {
  const kept = useStore(persist, (p) => p.kept);
  if (!kept) return null;
  return (
    <View style={s.conflict} accessibilityRole="alert" testID="kept-notice">
      <Text style={s.conflictTitle}>Your last changes before the page closed were not saved.</Text>
      <Text style={s.conflictText}>They were made {formatDateTime(kept.at)} and are kept on this device.</Text>
      <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' }}>
        <Button label="Put them back" onPress={() => persist.restoreKept()} />
        <Button kind="quiet" label="Discard them" onPress={() => persist.discardKept()} />
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
  sidePane: { height: 300, flexGrow: 0, borderTopWidth: 1, borderTopColor: colours.line, backgroundColor: colours.panel },
  right: { width: 340, flexGrow: 0, borderLeftWidth: 1, borderLeftColor: colours.line, backgroundColor: colours.panel },
  peek: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 14, paddingHorizontal: space.lg, marginBottom: 6 },
  tabs: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colours.line },
  tab: { flex: 1, alignItems: 'center', paddingVertical: 10, minHeight: 44 },
  tabOn: { borderBottomWidth: 2, borderBottomColor: colours.accent },
  tabText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13 },
  parts: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, paddingHorizontal: space.md, paddingTop: space.sm },
  part: { minHeight: 44, paddingHorizontal: space.md, justifyContent: 'center', borderRadius: 22, borderWidth: 1, borderColor: colours.line },
  partOn: { borderColor: colours.accent },
  partText: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13 },
  scrim: { flex: 1, backgroundColor: '#0008' },
  sheetKit: { marginBottom: 6 },
  kitBar: { paddingVertical: 6, borderBottomWidth: 1, borderColor: colours.line, backgroundColor: colours.panel },
  hint: { position: 'absolute', top: 12, left: 12, right: 60, color: colours.accentText, backgroundColor: colours.accent, fontFamily: fonts.sansMedium, fontSize: 13, padding: space.sm, borderRadius: 8 },
  kitSheet: { maxHeight: '70%', backgroundColor: colours.panel, borderTopLeftRadius: 16, borderTopRightRadius: 16 },
  conflict: { backgroundColor: '#3a2a1c', borderBottomWidth: 1, borderBottomColor: colours.accent, padding: space.md, gap: space.sm },
  conflictTitle: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 15 },
  conflictText: { color: colours.text, fontFamily: fonts.sans, fontSize: 13 },
});
