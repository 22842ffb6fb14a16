// Send it to the crew, from the editor: a preview of the plan as printed, the crew sheet PDF and plan images
// with download progress, read-only links, and e-mail. Crew see the downloads and the links, not the making.
import { useMemo, useState } from 'react';
import { Image, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { useMe } from '../../hooks/me';
import { useSetup } from '../../hooks/setups';
import type { PaperSize } from '../../model/api';
import { crewSheet } from '../../model/crewSheet';
import { Segmented } from '../Chips';
import { Body } from '../ui';
import { KeepOfflineToggle } from '../offline/KeepOfflineToggle';
import { ExportButtons } from './ExportButtons';
import { SendToCrew } from './SendToCrew';
import { ShareLinks } from './ShareLinks';
import { fileStem } from '../../model/fileNames';

export function CrewSheetPanel({ setupId }: { setupId: string }) {
  const setup = useSetup(setupId);
  const me = useMe();
  const [paper, setPaper] = useState<PaperSize | null>(null);
  const units = me.data?.user.units ?? 'metric';
  const chosenPaper = paper ?? me.data?.user.paper ?? 'a4';
  const doc = setup.data?.document;
  const sheet = useMemo(() => (doc ? crewSheet(doc, { title: setup.data!.title, units }) : null), [doc, setup.data, units]);
  if (!setup.data || !doc || !sheet) return <View style={s.wrap} />;
  const canShare = setup.data.role === 'owner' || setup.data.role === 'editor';
  const aspect = (doc.stage.widthM + 1) / (doc.stage.depthM + 1);
  const base = `/api/setups/${setupId}`;
  const others = sheet.gear.filter((g) => g.what !== 'Stands' && g.what !== 'Sandbags').length;

  return (
    <View style={s.wrap} accessibilityLabel="Crew sheet">
      <Text style={s.heading}>Crew sheet</Text>
      <View style={s.preview}>
        <Image
          source={{ uri: `${base}/plan.png?width=900&v=${setup.data.version}` }}
          style={{ width: '100%', aspectRatio: aspect }}
          resizeMode="contain"
          accessibilityLabel={`The plan as printed on the crew sheet: ${sheet.stage}`}
          testID="crew-sheet-preview"
        />
      </View>
      <Body dim style={s.small}>
        One page: the plan to scale, {sheet.lights.length} light{sheet.lights.length === 1 ? '' : 's'} and {others} other item{others === 1 ? '' : 's'} in the kit, camera and meter, {sheet.steps.length} step
        {sheet.steps.length === 1 ? '' : 's'}, {sheet.shots.length} shot{sheet.shots.length === 1 ? '' : 's'}, and the safety notes.
      </Body>
      <Segmented
        label="Paper"
        value={chosenPaper}
        onChange={setPaper}
        options={[
          { value: 'a4', label: 'A4' },
          { value: 'letter', label: 'US Letter' },
        ]}
      />
      <ExportButtons base={base} fileStem={fileStem(setup.data.title)} query={`paper=${chosenPaper}`} />
      <KeepOfflineToggle setupId={setupId} title={setup.data.title} version={setup.data.version} paper={chosenPaper} />
      <View style={s.rule} />
      <ShareLinks setupId={setupId} canShare={canShare} />
      {canShare ? (
        <>
          <View style={s.rule} />
          <SendToCrew setupId={setupId} />
        </>
      ) : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { padding: space.lg, gap: space.md },
  heading: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 18 },
  preview: { backgroundColor: colours.paper, borderRadius: radius.md, padding: space.sm, overflow: 'hidden' },
  small: { fontSize: 13, lineHeight: 18 },
  rule: { height: 1, backgroundColor: colours.line },
});
