// The lesson player: walks through each setup of a lesson step by step. The plan shows what is placed by
// that step, the Meter reads it, and a line says in plain words what the step changed. On a phone it is one
// column; wide, the plan sits beside the words; in presentation mode the type is large for a projector.
// Keyboard: → / PageDown / Space next, ← / PageUp back, Home / End, Esc leaves presentation mode.
import { useEffect, useMemo, useState } from 'react';
import { Platform, Pressable, ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { TABLET_MIN, WIDE_MIN, colours, fonts, space } from '../../constants/theme';
import type { LessonDetail } from '../../model/api';
import { describeChange, stepChangeLine } from '../../model/classes';
import type { SetupDocument } from '../../model/document';
import { keyFillDetail } from '../../model/format';
import { computeReadings, type Readings } from '../../model/setupReadings';
import { formatAperture, formatStops, type Units } from '../../model/units';
import { MeterPanel } from '../editor/MeterPanel';
import { FrameView as CameraFrame } from '../frame/FrameView';
import { ReadOnlyPlan, usePlanAtStep, useSelectedLight } from './ReadOnlyPlan';

type Frame = { entry: number; step: number | undefined };

function lessonFrames(lesson: LessonDetail): Frame[] {
  return lesson.setups.flatMap((e, entry): Frame[] => (e.document.steps.length ? e.document.steps.map((_s, step) => ({ entry, step })) : [{ entry, step: undefined }]));
}

/** The change line for a frame; a setup without steps is described as a whole. */
function frameLine(doc: SetupDocument, step: number | undefined): string {
  if (step !== undefined) return stepChangeLine(doc, step);
  const r = computeReadings(doc);
  return describeChange({ added: doc.items, before: null, after: r.meter, missingAfter: r.build.missing, first: true });
}

const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

function useStepKeys(count: number, setIndex: (f: (i: number) => number) => void, onExit?: () => void) {
  useEffect(() => {
    if (Platform.OS !== 'web' || typeof window === 'undefined') return;
    const down = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.isContentEditable)) return;
      const to: Record<string, (i: number) => number> = {
        ArrowRight: (i) => Math.min(count - 1, i + 1),
        PageDown: (i) => Math.min(count - 1, i + 1),
        ' ': (i) => Math.min(count - 1, i + 1),
        ArrowLeft: (i) => Math.max(0, i - 1),
        PageUp: (i) => Math.max(0, i - 1),
        Home: () => 0,
        End: () => count - 1,
      };
      if (to[e.key]) {
        e.preventDefault();
        setIndex(to[e.key]!);
      } else if (e.key === 'Escape' && onExit) onExit();
    };
    window.addEventListener('keydown', down);
    return () => window.removeEventListener('keydown', down);
  }, [count, setIndex, onExit]);
}

export function LessonPlayer({ lesson, units, present = false, onExit, header }: { lesson: LessonDetail; units: Units; present?: boolean; onExit?: () => void; header?: React.ReactNode }) {
  const { width } = useWindowDimensions();
  const frames = useMemo(() => lessonFrames(lesson), [lesson]);
  const [index, setIndex] = useState(0);
  useStepKeys(frames.length, setIndex, onExit);
  if (!frames.length) {
    return (
      <View style={[st.root, { padding: space.lg }]}>
        {header}
        <Text style={st.line}>This lesson has no setups yet.</Text>
      </View>
    );
  }
  const f = frames[Math.min(index, frames.length - 1)]!;
  const entry = lesson.setups[f.entry]!;
  const wide = width >= (present ? TABLET_MIN : WIDE_MIN);
  return (
    <FrameView
      key={entry.id}
      lesson={lesson}
      frames={frames}
      index={index}
      setIndex={setIndex}
      units={units}
      present={present}
      wide={wide}
      header={header}
    />
  );
}

function FrameView({
  lesson,
  frames,
  index,
  setIndex,
  units,
  present,
  wide,
  header,
}: {
  lesson: LessonDetail;
  frames: Frame[];
  index: number;
  setIndex: (f: (i: number) => number) => void;
  units: Units;
  present: boolean;
  wide: boolean;
  header?: React.ReactNode;
}) {
  const { width } = useWindowDimensions();
  const f = frames[index]!;
  const entry = lesson.setups[f.entry]!;
  const doc = entry.document;
  const step = f.step !== undefined ? doc.steps[f.step] : undefined;
  const { store, readings } = usePlanAtStep(doc, f.step);
  const selectedLight = useSelectedLight(store);
  const line = useMemo(() => capital(frameLine(doc, f.step)), [doc, f.step]);
  const stepCount = doc.steps.length;
  const where = `Setup ${f.entry + 1} of ${lesson.setups.length}${f.step !== undefined ? ` · step ${f.step + 1} of ${stepCount}` : ''}`;
  const big = present;

  const words = (
    <View style={{ gap: big ? space.lg : space.sm }}>
      <Text style={[st.where, big && { fontSize: 20 }]} testID="player-position">
        {where}
      </Text>
      <Text style={[st.setupTitle, big && { fontSize: 40, lineHeight: 48 }]} role="heading" aria-level={2}>
        {step?.title ? step.title : entry.title}
      </Text>
      {step?.title ? <Text style={[st.dim, big && { fontSize: 22 }]}>{entry.title}</Text> : null}
      <Text style={[st.line, big && { fontSize: 32, lineHeight: 42 }]} testID="change-line" accessibilityLiveRegion="polite">
        {line}
      </Text>
      {f.step === 0 || f.step === undefined ? entry.note ? <Text style={[st.note, big && st.noteBig]}>{entry.note}</Text> : null : null}
      {step && entry.stepNotes[step.id] ? (
        <Text style={[st.note, big && st.noteBig]} testID="instructor-note">
          {entry.stepNotes[step.id]}
        </Text>
      ) : null}
      {step?.note ? <Text style={[st.dim, big && { fontSize: 22, lineHeight: 30 }]}>{step.note}</Text> : null}
    </View>
  );

  const nav = <StepNav frames={frames} index={index} setIndex={setIndex} big={big} />;
  const plan = <ReadOnlyPlan store={store} readings={readings} units={units} testID="player-plan" />;
  // The frame as the plan stands at this step: step through and watch the picture change as each light is added.
  const frameOf = (w: number) => <CameraFrame doc={doc} stepIndex={f.step} paneWidth={w} testID="player-frame" />;

  if (present) {
    return (
      <View style={[st.root, { backgroundColor: '#121417' }]} testID="presentation">
        {header}
        <View style={[{ flex: 1, gap: space.xl, padding: space.xl }, wide && { flexDirection: 'row' }]}>
          <View style={{ flex: wide ? 3 : 1, minHeight: 280 }}>{plan}</View>
          <ScrollView style={{ flex: 2 }} contentContainerStyle={{ gap: space.xl }}>
            {words}
            {frameOf(480)}
            <BigMeter readings={readings} big />
          </ScrollView>
        </View>
        <View style={{ paddingHorizontal: space.xl, paddingBottom: space.lg }}>{nav}</View>
      </View>
    );
  }

  if (wide) {
    return (
      <View style={[st.root, { flexDirection: 'row' }]}>
        <View style={{ flex: 1, padding: space.lg, gap: space.md }}>
          {header}
          <View style={{ flex: 1 }}>{plan}</View>
          {nav}
        </View>
        <ScrollView style={st.side} contentContainerStyle={{ padding: space.lg, gap: space.md }}>
          {words}
          {frameOf(440 - 2 * space.lg - 2 * space.md)}
          <BigMeter readings={readings} />
          <MeterPanel readings={readings} doc={doc} selectedLight={selectedLight} units={units} />
        </ScrollView>
      </View>
    );
  }

  return (
    <ScrollView style={st.root} contentContainerStyle={{ padding: space.md, gap: space.md, paddingBottom: 48 }}>
      {header}
      <View style={{ height: 340 }}>{plan}</View>
      {nav}
      {words}
      {frameOf(Math.min(640, width - 4 * space.md))}
      <BigMeter readings={readings} />
      <MeterPanel readings={readings} doc={doc} selectedLight={selectedLight} units={units} />
    </ScrollView>
  );
}

/** Previous / next with a strip of the lesson's frames (tap one to jump there). */
function StepNav({ frames, index, setIndex, big }: { frames: Frame[]; index: number; setIndex: (f: (i: number) => number) => void; big: boolean }) {
  return (
    <View style={{ gap: space.sm }}>
      <View style={st.strip} accessibilityLabel={`Frame ${index + 1} of ${frames.length}`}>
        {frames.map((fr, k) => (
          <Pressable
            key={k}
            onPress={() => setIndex(() => k)}
            accessibilityRole="button"
            accessibilityLabel={`Go to setup ${fr.entry + 1}${fr.step !== undefined ? `, step ${fr.step + 1}` : ''}`}
            // The bar is 8 px; the button around it 44 px high, so a finger can take a step.
            style={[st.tickHit, k > 0 && frames[k - 1]!.entry !== fr.entry && { marginLeft: 8 }]}
          >
            <View style={[st.tick, k <= index && { backgroundColor: colours.accent }]} />
          </Pressable>
        ))}
      </View>
      <View style={{ flexDirection: 'row', gap: space.sm }}>
        <NavButton label="Back to the previous step" text="‹ Back" disabled={index === 0} onPress={() => setIndex((i) => Math.max(0, i - 1))} big={big} />
        <NavButton label="Next step" text="Next ›" disabled={index === frames.length - 1} onPress={() => setIndex((i) => Math.min(frames.length - 1, i + 1))} big={big} primary />
      </View>
    </View>
  );
}

function NavButton({ label, text, onPress, disabled, big, primary }: { label: string; text: string; onPress: () => void; disabled: boolean; big: boolean; primary?: boolean }) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ disabled }}
      disabled={disabled}
      onPress={onPress}
      style={({ pressed }) => [st.navButton, primary && { backgroundColor: colours.accent, borderColor: colours.accent }, big && { minHeight: 64 }, pressed && { opacity: 0.8 }, disabled && { opacity: 0.35 }]}
    >
      <Text style={[st.navText, primary && { color: colours.accentText }, big && { fontSize: 22 }]}>{text}</Text>
    </Pressable>
  );
}

/** The readings a class looks at, large: subject, background, key:fill, room light. */
export function BigMeter({ readings, compact = false, big = false }: { readings: Readings; compact?: boolean; big?: boolean }) {
  const m = readings.meter;
  if (!m) return <Text style={st.dim}>{readings.build.missing.length ? `Add ${readings.build.missing.join(' and ')} to read the light.` : 'The meter cannot read this plan.'}</Text>;
  const cells = [
    { label: 'Subject', value: formatAperture(m.subject.aperture), detail: `${formatStops(m.subject.stopsVsCamera)} vs the camera`, id: 'subject' },
    { label: 'Background', value: m.background?.stopsVsSubject != null ? formatStops(m.background.stopsVsSubject) : '—', detail: 'stops vs the subject', id: 'background' },
    { label: 'Key : fill', value: m.keyFill.ratio !== null ? `${m.keyFill.ratio.toFixed(1)}:1` : '—', detail: keyFillDetail(m.keyFill), id: 'keyfill' },
    ...(m.ambient ? [{ label: 'Room light', value: formatStops(m.ambient.stopsVsCamera), detail: 'stops vs the camera', id: 'ambient' }] : []),
  ];
  return (
    <View style={st.meter} accessibilityLabel="Meter at this step">
      {cells.map((c) => (
        <View key={c.id} style={[st.cell, compact && { minWidth: 90 }, big && { minWidth: 200 }]}>
          <Text style={[st.cellLabel, big && { fontSize: 20 }]}>{c.label}</Text>
          <Text style={[st.cellValue, compact && { fontSize: 20 }, big && { fontSize: 48 }]} testID={`step-meter-${c.id}`}>
            {c.value}
          </Text>
          <Text style={[st.cellDetail, big && { fontSize: 16 }]}>{c.detail}</Text>
        </View>
      ))}
    </View>
  );
}

const st = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  side: { width: 440, flexGrow: 0, borderLeftWidth: 1, borderLeftColor: colours.line, backgroundColor: colours.panel },
  where: { color: colours.cool, fontFamily: fonts.mono, fontSize: 13 },
  setupTitle: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 22, lineHeight: 28 },
  line: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 18, lineHeight: 26 },
  note: { color: colours.text, fontFamily: fonts.sans, fontSize: 15, lineHeight: 22, borderLeftWidth: 3, borderLeftColor: colours.accent, paddingLeft: space.md },
  noteBig: { fontSize: 26, lineHeight: 36 },
  dim: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 14, lineHeight: 20 },
  strip: { flexDirection: 'row', gap: 4, flexWrap: 'wrap' },
  tickHit: { flexGrow: 1, flexBasis: 24, minWidth: 24, height: 44, justifyContent: 'center' },
  tick: { height: 8, borderRadius: 4, backgroundColor: colours.line },
  navButton: { flex: 1, minHeight: 48, borderRadius: 10, borderWidth: 1, borderColor: colours.line, alignItems: 'center', justifyContent: 'center' },
  navText: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 16 },
  meter: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  cell: { flexGrow: 1, minWidth: 120, backgroundColor: colours.graphite, borderRadius: 10, borderWidth: 1, borderColor: colours.line, padding: space.md },
  cellLabel: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 13 },
  cellValue: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 28 },
  cellDetail: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 11 },
});
