// The setup behind a read-only link, for the crew on a phone: the numbers to set first, the plan (pan and
// pinch, nothing moves), the downloads, the kit with power and heights, the meter, steps, shots and safety.
import { useMemo } from 'react';
import { ScrollView, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { PlanCanvas } from '../../canvas/PlanCanvas';
import { useReadings } from '../../canvas/useReadings';
import { createEditor } from '../../canvas/editor/editor';
import { EditorContext } from '../../canvas/editor/react';
import { graphiteTheme } from '../../canvas/views';
import { colours, fonts, radius, space } from '../../constants/theme';
import { ApiRequestError } from '../../hooks/api';
import { useShareMembership, useSharedSetup } from '../../hooks/shares';
import { CommentThread } from '../comments/CommentThread';
import { crewSheet, type CrewSheet, type Reading } from '../../model/crewSheet';
import { readingsPending } from '../../model/setupReadings';
import { SharedShell } from '../SharedShell';
import { Body, Title } from '../ui';
import { FrameView } from '../frame/FrameView';
import { ExportButtons } from './ExportButtons';
import { fileStem } from '../../model/fileNames';
import { formatDate } from '../../model/format';
import { usePageTitle } from '../../hooks/pageTitle';
import { useAfterFirstPaint } from '../../hooks/afterFirstPaint';
import { SkipLink } from '../SkipLink';

export function SharedSetupScreen({ token }: { token: string }) {
  const q = useSharedSetup(token);
  usePageTitle(q.isError ? 'Link opens nothing' : q.data?.title);
  if (q.isPending) return <SharedShell />;
  if (q.isError) {
    const gone = q.error instanceof ApiRequestError && q.error.status === 404;
    return (
      <View style={s.page}>
        <View style={s.column}>
          <Text style={s.brand}>FALLOFF</Text>
          <Title>{gone ? 'This link opens nothing' : 'The setup could not be loaded'}</Title>
          <Body dim>{gone ? 'It may have been withdrawn. Ask the photographer for a new link.' : `Try again in a moment. (${q.error.message})`}</Body>
        </View>
      </View>
    );
  }
  return <Shared token={token} data={q.data} />;
}

function Shared({ token, data }: { token: string; data: NonNullable<ReturnType<typeof useSharedSetup>['data']> }) {
  const { width, height } = useWindowDimensions();
  const doc = data.document;
  const store = useMemo(() => createEditor(doc, { readOnly: true }), [doc]);
  // From the meter's worker, after the plan has painted (null until then: the sheet says it is reading).
  const readings = useReadings(doc, { lightMap: true });
  const sheet = useMemo(() => crewSheet(doc, { title: data.title, units: data.units, readings: readings ?? readingsPending }), [doc, data.title, data.units, readings]);
  const planH = Math.round(Math.min(Math.max(280, Math.min(width, 760) * ((doc.stage.depthM + 1) / (doc.stage.widthM + 1))), height * 0.62));
  const saved = formatDate(data.updatedAt);
  // What is below the plan renders in a task of its own, once the top has painted.
  const rest = useAfterFirstPaint();
  return (
    <ScrollView style={s.page} contentContainerStyle={{ paddingBottom: space.xxl }}>
      <SkipLink />
      <View style={s.column}>
        <Text style={s.brand}>FALLOFF · READ-ONLY</Text>
        <Text style={s.title} accessibilityRole="header">
          {data.title}
        </Text>
        <Text style={s.meta}>
          {data.studioName} · version {data.version} · saved {saved}
        </Text>
        <FirstNumbers sheet={sheet} reading={!readings} />
      </View>
      <View style={[s.plan, { height: planH }]} testID="shared-plan">
        <EditorContext.Provider value={store}>
          <PlanCanvas theme={graphiteTheme} units={data.units} lightMap={readings?.map ?? null} testID="plan" />
        </EditorContext.Provider>
      </View>
      {rest ? <Below token={token} data={data} sheet={sheet} paneWidth={Math.min(width, 760) - 2 * space.md - 2 * space.md} /> : null}
    </ScrollView>
  );
}

/** The page below the plan: downloads, the look, the kit, the numbers, steps, shots, notes, comments and safety. */
function Below({ token, data, sheet, paneWidth }: { token: string; data: NonNullable<ReturnType<typeof useSharedSetup>['data']>; sheet: CrewSheet; paneWidth: number }) {
  const doc = data.document;
  return (
    <View style={s.column}>
      <Text style={s.hint}>Drag to look around, pinch to zoom. Nothing here can be changed.</Text>
      <ExportButtons base={`/api/shared/${token}`} fileStem={fileStem(data.title)} />
      <Section title="The look we are after">
        <FrameView doc={doc} paneWidth={paneWidth} testID="shared-frame" />
      </Section>
      <Kit sheet={sheet} />
      <Section title="Camera">{sheet.camera.map(row)}</Section>
      <Section title="Meter at the subject">
        {sheet.readings.map(row)}
        {sheet.warnings.map((w) => (
          <Text key={w} style={s.warn}>
            ⚠ {w}
          </Text>
        ))}
      </Section>
      {sheet.steps.length ? (
        <Section title="Steps">
          {sheet.steps.map((st) => (
            <View key={st.n} style={s.item}>
              <Text style={s.itemName}>
                {st.n}. {st.title}
              </Text>
              {st.note ? <Text style={s.text}>{st.note}</Text> : null}
              {st.adds.length ? <Text style={s.small}>Adds: {st.adds.join(', ')}</Text> : null}
            </View>
          ))}
        </Section>
      ) : null}
      {sheet.shots.length ? <Section title="Shot list">{sheet.shots.map((sh, k) => row({ label: `${sh.framing} · ${sh.lens}`, value: sh.settings, detail: sh.note || undefined }, k))}</Section> : null}
      <Notes text={data.notes} />
      <MemberComments token={token} data={data} />
      <Section title="Safety">
        {sheet.safety.map((c) => (
          <Text key={c} style={s.caution}>
            ▲ {c}
          </Text>
        ))}
      </Section>
    </View>
  );
}

/** Signed-in members of the setup's studio talk here too; everyone else sees nothing of the comments. */
function MemberComments({ token, data }: { token: string; data: NonNullable<ReturnType<typeof useSharedSetup>['data']> }) {
  const m = useShareMembership(token);
  if (!m.data) return null;
  return (
    <View style={s.section}>
      <CommentThread setupId={m.data.setupId} doc={data.document} units={data.units} me={m.data.me} canWrite={m.data.role !== 'crew'} />
    </View>
  );
}

function FirstNumbers({ sheet, reading }: { sheet: CrewSheet; reading: boolean }) {
  const cam = sheet.camera[0]!;
  const subject = sheet.readings[0]!;
  return (
    <View style={s.first}>
      <View style={s.firstRow}>
        <Text style={s.firstLabel}>CAMERA</Text>
        <Text style={s.firstValue} testID="shared-camera">
          {cam.value}
        </Text>
      </View>
      <View style={s.firstRow}>
        <Text style={s.firstLabel}>SUBJECT READS</Text>
        <Text style={[s.firstValue, reading && { color: colours.textDim }]} testID="shared-subject">
          {reading ? 'reading…' : subject.value}
        </Text>
      </View>
    </View>
  );
}

function Kit({ sheet }: { sheet: CrewSheet }) {
  return (
    <Section title={`Kit · ${sheet.lights.length} light${sheet.lights.length === 1 ? '' : 's'}`}>
      {sheet.lights.map((l) => (
        <View key={l.id} style={s.item} testID="shared-light">
          <View style={s.lightHead}>
            <Text style={[s.itemName, !l.on && { color: colours.textDim }]}>
              {l.name}
              {l.on ? '' : ' (off)'}
            </Text>
            <Text style={s.power}>{l.power}</Text>
          </View>
          <Text style={s.text}>{[l.source, l.modifier, l.gel ? `gel: ${l.gel}` : 'no gel'].join(' · ')}</Text>
          <Text style={s.small}>
            height {l.height} · {l.aim} · {l.stand}
          </Text>
        </View>
      ))}
      {sheet.gear.map((g) => (
        <Text key={g.what + g.detail} style={s.text}>
          <Text style={s.itemName}>{g.what}:</Text> {g.detail}
        </Text>
      ))}
    </Section>
  );
}

function Notes({ text }: { text: string }) {
  if (!text.trim()) return null;
  return (
    <Section title="Notes">
      <Text style={s.text}>{text}</Text>
    </Section>
  );
}

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <View style={s.section}>
      <Text style={s.sectionTitle} role="heading" aria-level={2}>
        {title}
      </Text>
      {children}
    </View>
  );
}

function row(r: Reading, k: number) {
  return (
    <View key={`${r.label}-${k}`} style={s.reading}>
      <View style={{ flex: 1 }}>
        <Text style={s.readingLabel}>{r.label}</Text>
        {r.detail ? <Text style={s.small}>{r.detail}</Text> : null}
      </View>
      <Text style={s.readingValue}>{r.value}</Text>
    </View>
  );
}

const s = StyleSheet.create({
  page: { flex: 1, backgroundColor: colours.graphite },
  column: { width: '100%', maxWidth: 760, alignSelf: 'center', paddingHorizontal: space.lg, gap: space.md, paddingTop: space.md },
  brand: { color: colours.accent, fontFamily: fonts.monoMedium, fontSize: 11, letterSpacing: 2, marginTop: space.md },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 24, lineHeight: 30 },
  meta: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 13, marginTop: -space.sm },
  first: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colours.panel, borderWidth: 1, borderColor: colours.line },
  firstRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.sm },
  firstLabel: { color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 10, letterSpacing: 1.5 },
  firstValue: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 17, flexShrink: 1, textAlign: 'right' },
  plan: { width: '100%', maxWidth: 760, alignSelf: 'center', marginTop: space.md, borderTopWidth: 1, borderBottomWidth: 1, borderColor: colours.line },
  hint: { color: colours.textFaint, fontFamily: fonts.sans, fontSize: 12 },
  section: { gap: space.sm, paddingTop: space.md, borderTopWidth: 1, borderTopColor: colours.line },
  sectionTitle: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17 },
  item: { gap: 2, paddingVertical: 4 },
  lightHead: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm },
  itemName: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
  power: { color: colours.accent, fontFamily: fonts.monoMedium, fontSize: 15 },
  text: { color: colours.text, fontFamily: fonts.sans, fontSize: 14, lineHeight: 20 },
  small: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 12, lineHeight: 17 },
  reading: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingVertical: 3 },
  readingLabel: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  readingValue: { color: colours.text, fontFamily: fonts.monoMedium, fontSize: 14, flexShrink: 1, textAlign: 'right' },
  warn: { color: colours.danger, fontFamily: fonts.sans, fontSize: 14 },
  caution: { color: '#f2c46d', fontFamily: fonts.sans, fontSize: 14, lineHeight: 20 },
});
