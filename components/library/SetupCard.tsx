// One setup in the library: tap to open it; its actions depend on the section and on the caller's role
// (crew get no delete: they cannot change the studio's setups).
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import type { LibrarySection } from '../../hooks/setups';
import type { SetupSummary } from '../../model/api';
import { Body, Card } from '../ui';
import { count, formatDate } from '../../model/format';

export type CardActions = {
  onOpen: (s: SetupSummary) => void;
  onDuplicate: (s: SetupSummary) => void;
  onDelete: (s: SetupSummary) => void;
  onRestore: (s: SetupSummary) => void;
};

const canWrite = (s: SetupSummary) => s.role === 'owner' || s.role === 'editor';
const day = (iso: string) => formatDate(iso);

/** pickedNo: while picking a shoot day, the setup's place in it (0: not chosen); null when not picking. */
export function SetupCard({ setup, section, maxWidth, actions, pickedNo = null }: { setup: SetupSummary; section: LibrarySection; maxWidth: `${number}%`; actions: CardActions; pickedNo?: number | null }) {
  const deleted = section === 'deleted';
  return (
    <Card style={{ flex: 1, maxWidth, marginBottom: space.md, padding: 0 }}>
      {/* The whole card opens the setup to a pointer; to a keyboard and a screen reader the link is the title
          (its name is its visible words), and the details read as text after it. */}
      <Pressable
        focusable={false}
        accessible={false}
        disabled={deleted}
        onPress={() => actions.onOpen(setup)}
        style={({ pressed, hovered }: { pressed: boolean; hovered?: boolean }) => [s.body, (pressed || hovered) && !deleted && { backgroundColor: colours.panelRaised }]}
      >
        <View style={s.titleRow} testID="setup-card-title-row">
          <Pressable
            testID="setup-card"
            accessibilityRole="link"
            accessibilityHint={deleted ? 'restore it to open it' : pickedNo !== null ? 'adds it to the shoot day, or takes it out' : 'opens the setup'}
            accessibilityState={pickedNo !== null ? { selected: pickedNo > 0 } : undefined}
            aria-selected={pickedNo !== null ? pickedNo > 0 : undefined}
            disabled={deleted}
            onPress={() => actions.onOpen(setup)}
            // 44 px high at least: a finger's target (one line of title is 26 px).
            style={{ flex: 1, minHeight: 44, justifyContent: 'center' }}
          >
            <Text style={s.title} numberOfLines={2}>
              {setup.title}
            </Text>
          </Pressable>
          {pickedNo ? (
            <Text style={s.picked} testID="picked-no">
              {pickedNo}
            </Text>
          ) : null}
          {setup.unreadComments ? (
            <Text style={s.unread} testID="unread-comments">
              {setup.unreadComments} new
            </Text>
          ) : null}
        </View>
        <Body dim>
          {setup.studioName}
          {setup.isTemplate ? ' · template' : ''}
        </Body>
        {setup.tags.length ? (
          <View style={s.tags}>
            {setup.tags.map((t) => (
              <Text key={t} style={s.tag}>
                {t}
              </Text>
            ))}
          </View>
        ) : null}
        <Text style={s.meta}>
          {deleted && setup.deletedAt && setup.restorableUntil
            ? `deleted ${day(setup.deletedAt)} · restorable until ${day(setup.restorableUntil)}`
            : `${count(setup.itemCount, 'item')} · updated ${day(setup.updatedAt)}${setup.ownerName ? ` · ${setup.ownerName}` : ''}`}
        </Text>
      </Pressable>
      <View style={s.actions}>
        {deleted ? (
          <Action label="Restore" a11y={`Restore ${setup.title}`} onPress={() => actions.onRestore(setup)} strong />
        ) : section === 'templates' ? (
          <Action label="Use template" a11y={`Use template ${setup.title}`} onPress={() => actions.onDuplicate(setup)} strong />
        ) : (
          <>
            <Action label="Duplicate" a11y={`Duplicate ${setup.title}`} onPress={() => actions.onDuplicate(setup)} />
            {canWrite(setup) ? <Action label="Delete" a11y={`Delete ${setup.title}`} onPress={() => actions.onDelete(setup)} danger /> : null}
            {setup.role === 'crew' ? <Text style={s.readOnly}>read-only</Text> : null}
          </>
        )}
      </View>
    </Card>
  );
}

function Action({ label, a11y, onPress, strong, danger }: { label: string; a11y: string; onPress: () => void; strong?: boolean; danger?: boolean }) {
  return (
    <Pressable accessibilityRole="button" accessibilityLabel={a11y} onPress={onPress} style={({ pressed }) => [s.action, pressed && { opacity: 0.7 }]} hitSlop={4}>
      <Text style={[s.actionText, strong && { color: colours.accent }, danger && { color: colours.danger }]}>{label}</Text>
    </Pressable>
  );
}

const s = StyleSheet.create({
  body: { padding: space.lg, paddingBottom: space.sm, borderTopLeftRadius: 16, borderTopRightRadius: 16 },
  title: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17, marginBottom: 4 },
  picked: { color: colours.accentText, backgroundColor: colours.accent, fontFamily: fonts.monoMedium, fontSize: 14, minWidth: 26, textAlign: 'center', borderRadius: 13, paddingVertical: 2, overflow: 'hidden' },
  titleRow: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
  unread: { color: colours.accentText, backgroundColor: colours.cool, fontFamily: fonts.monoMedium, fontSize: 12, borderRadius: 999, paddingHorizontal: 8, paddingVertical: 2, overflow: 'hidden' },
  tags: { flexDirection: 'row', flexWrap: 'wrap', gap: 6, marginTop: space.sm },
  tag: { color: colours.cool, fontFamily: fonts.mono, fontSize: 12, borderWidth: 1, borderColor: colours.line, borderRadius: 999, paddingHorizontal: 8, paddingVertical: 2 },
  meta: { color: colours.textFaint, fontFamily: fonts.mono, fontSize: 12, marginTop: space.sm },
  actions: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingHorizontal: space.sm, paddingBottom: space.sm, borderTopWidth: 1, borderTopColor: colours.line, marginTop: space.xs },
  action: { paddingHorizontal: space.md, minHeight: 44, justifyContent: 'center' },
  actionText: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  readOnly: { color: colours.textFaint, fontFamily: fonts.sans, fontSize: 13, marginLeft: 'auto', paddingHorizontal: space.md },
});
