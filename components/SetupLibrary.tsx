// The Setups library: the user's setups (search as you type, tags, studios, sort), every studio's templates,
// and the deleted ones that can still be restored. New, duplicate, delete and restore, each with an undo.
import { useRouter } from 'expo-router';
import { useEffect, useMemo, useState } from 'react';
import { ActivityIndicator, FlatList, StyleSheet, Text, TextInput, View, useWindowDimensions } from 'react-native';
import { TABLET_MIN, WIDE_MIN, colours, fonts, radius, space } from '../constants/theme';
import { useMe } from '../hooks/me';
import { useCreateSetup, useDeleteSetup, useDuplicateSetup, useRestoreSetup, useSetupList, useTags, type LibrarySection, type SetupFilter } from '../hooks/setups';
import type { SetupSort, SetupSummary } from '../model/api';
import { Chip, ChipRow, Segmented } from './Chips';
import { InvitationBanner } from './library/InvitationBanner';
import { DaySheetBar } from './library/DaySheetBar';
import { SetupCard, type CardActions } from './library/SetupCard';
import { ConfirmDeleteDialog, DuplicateDialog, NewSetupDialog, writableStudios } from './library/SetupDialogs';
import { Toast, useToast } from './Toast';
import { Body, Button, Card, ErrorText, Title } from './ui';
import { count } from '../model/format';
import { usePageTitle } from '../hooks/pageTitle';

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

const sections: { value: LibrarySection; label: string }[] = [
  { value: 'library', label: 'Setups' },
  { value: 'templates', label: 'Templates' },
  { value: 'deleted', label: 'Deleted' },
];
const sorts: { value: SetupSort; label: string }[] = [
  { value: 'updated', label: 'Recent' },
  { value: 'created', label: 'Newest' },
  { value: 'title', label: 'A–Z' },
];

export function SetupLibrary() {
  usePageTitle('Setups');
  const router = useRouter();
  const { width } = useWindowDimensions();
  const columns = width >= WIDE_MIN + 300 ? 3 : width >= TABLET_MIN ? 2 : 1;
  // A short last row keeps the column width instead of stretching.
  const maxCardWidth: `${number}%` = columns > 1 ? `${Math.floor(1000 / columns) / 10 - 1}%` : '100%';

  const [section, setSection] = useState<LibrarySection>('library');
  const [text, setText] = useState('');
  const [studio, setStudio] = useState<string | undefined>();
  const [tag, setTag] = useState<string | undefined>();
  const [sort, setSort] = useState<SetupSort>('updated');
  const q = useDebounced(text.trim(), 250);
  // Only what narrows the list goes into the filter (and so into the query key and the URL).
  const filter: SetupFilter = {
    ...(section !== 'library' ? { section } : {}),
    ...(q ? { q } : {}),
    ...(studio && section !== 'templates' ? { studio } : {}),
    ...(tag && section === 'library' ? { tag } : {}),
    ...(sort !== 'updated' && section !== 'deleted' ? { sort } : {}),
  };
  const list = useSetupList(filter);
  const setups = useMemo(() => list.data?.pages.flatMap((p) => p.setups ?? []) ?? [], [list.data]);

  const me = useMe();
  const studios = Array.isArray(me.data?.studios) ? me.data.studios : [];
  const tags = useTags(section === 'library' ? studio : undefined);

  const create = useCreateSetup();
  const duplicate = useDuplicateSetup();
  const remove = useDeleteSetup();
  const restore = useRestoreSetup();
  const toast = useToast();
  const [creating, setCreating] = useState(false);
  const [copying, setCopying] = useState<SetupSummary | null>(null);
  const [deleting, setDeleting] = useState<SetupSummary | null>(null);
  /** Picking setups for a shoot day's sheets, in the order tapped; null when not picking. */
  const [picking, setPicking] = useState<string[] | null>(null);

  const open = (id: string) => router.push(`/setups/${id}`);
  const failed = (what: string) => (e: Error) => toast.show({ text: `${what} failed: ${e.message}` });
  const deleteNow = (s: SetupSummary) => {
    setDeleting(null);
    remove.mutate(s.id, {
      onSuccess: () => toast.show({ text: `Deleted “${s.title}”.`, actions: [{ label: 'Undo', onPress: () => restore.mutate(s.id, { onError: failed('Undo') }) }] }),
      onError: failed('Delete'),
    });
  };
  const actions: CardActions = {
    onOpen: (s) => (picking ? setPicking(picking.includes(s.id) ? picking.filter((x) => x !== s.id) : [...picking, s.id]) : open(s.id)),
    onDuplicate: (s) => setCopying(s),
    onDelete: (s) => setDeleting(s),
    onRestore: (s) =>
      restore.mutate(s.id, {
        onSuccess: () =>
          toast.show({
            text: `Restored “${s.title}”.`,
            actions: [
              { label: 'Open', onPress: () => open(s.id) },
              { label: 'Undo', onPress: () => remove.mutate(s.id, { onError: failed('Undo') }) },
            ],
          }),
        onError: failed('Restore'),
      }),
  };

  const filtering = q.length > 0 || !!tag;
  const phone = width < TABLET_MIN;
  const nextSort = () => setSort(sorts[(sorts.findIndex((o) => o.value === sort) + 1) % sorts.length]!.value);
  const studioChips =
    section !== 'templates' && studios.length > 1
      ? [
          <Chip key="all" label="All studios" selected={!studio} onPress={() => setStudio(undefined)} />,
          ...studios.map((st) => <Chip key={st.id} label={st.name} selected={studio === st.id} onPress={() => setStudio(studio === st.id ? undefined : st.id)} />),
        ]
      : [];
  const tagChips =
    section === 'library'
      ? (tags.data ?? []).map((t) => (
          <Chip key={`#${t.tag}`} label={`#${t.tag}`} hint={count(t.count, 'setup')} selected={tag === t.tag} onPress={() => setTag(tag === t.tag ? undefined : t.tag)} />
        ))
      : [];
  return (
    <View style={s.root}>
      <View style={s.head}>
        <View style={s.titleRow}>
          <Title>Setups</Title>
          <View style={{ flexDirection: 'row', gap: space.sm }}>
            {section === 'library' && !picking ? <Button kind="quiet" label="Day sheets" onPress={() => setPicking([])} testID="pick-day" /> : null}
            {writableStudios(studios).length ? <Button label="New setup" onPress={() => setCreating(true)} testID="new-setup" /> : null}
          </View>
        </View>
        <InvitationBanner onJoined={(name) => toast.show({ text: `You joined ${name}.` })} />
        <TextInput
          value={text}
          onChangeText={setText}
          placeholder={section === 'templates' ? 'Search templates' : 'Search titles, notes and tags'}
          placeholderTextColor={colours.textFaint}
          accessibilityLabel="Search setups"
          style={s.search}
        />
        <View style={s.controls}>
          <Segmented options={sections} value={section} onChange={setSection} label="Library section" />
          {section !== 'deleted' && !phone ? <Segmented options={sorts} value={sort} onChange={setSort} label="Sort by" /> : null}
        </View>
        {/* On a phone the sort, studios and tags share one row that scrolls sideways; wide, each has its own. */}
        {phone ? (
          <ChipRow label="Sort and filter">
            {section !== 'deleted' ? <Chip label={`Sort: ${sorts.find((o) => o.value === sort)!.label}`} hint="changes the order" selected={false} onPress={nextSort} /> : null}
            {studioChips}
            {tagChips}
          </ChipRow>
        ) : (
          <>
            {studioChips.length ? <ChipRow label="Studio">{studioChips}</ChipRow> : null}
            {tagChips.length ? <ChipRow label="Filter by tag">{tagChips}</ChipRow> : null}
          </>
        )}
      </View>
      {list.isPending ? (
        <ActivityIndicator color={colours.accent} style={{ marginTop: space.xl }} />
      ) : list.isError ? (
        <View style={{ padding: space.lg }}>
          <ErrorText>Could not load your setups: {list.error.message}</ErrorText>
        </View>
      ) : (
        <FlatList
          key={columns}
          data={setups}
          numColumns={columns}
          keyExtractor={(x) => x.id}
          contentContainerStyle={s.list}
          columnWrapperStyle={columns > 1 ? { gap: space.md } : undefined}
          renderItem={({ item }) => <SetupCard setup={item} section={section} maxWidth={maxCardWidth} actions={actions} pickedNo={picking ? picking.indexOf(item.id) + 1 || 0 : null} />}
          onEndReachedThreshold={0.5}
          onEndReached={() => list.hasNextPage && !list.isFetchingNextPage && list.fetchNextPage()}
          ListFooterComponent={list.isFetchingNextPage ? <ActivityIndicator color={colours.accent} style={{ margin: space.lg }} /> : null}
          ListEmptyComponent={
            <EmptyLibrary
              section={section}
              filtering={filtering}
              onNew={() => setCreating(true)}
              onTemplates={() => setSection('templates')}
              onClear={() => {
                setText('');
                setTag(undefined);
              }}
            />
          }
          accessibilityLabel={section === 'templates' ? 'Templates' : section === 'deleted' ? 'Deleted setups' : 'Your setups'}
        />
      )}

      {picking && section === 'library' ? <DaySheetBar chosen={picking} onDone={() => setPicking(null)} /> : null}
      <NewSetupDialog
        visible={creating}
        studios={studios}
        defaultStudio={studio}
        onClose={() => setCreating(false)}
        onSubmit={async (v) => {
          const made = await create.mutateAsync({ title: v.title, studioId: v.studioId, tags: v.tags });
          setCreating(false);
          open(made.id);
        }}
      />
      <DuplicateDialog
        source={copying}
        studios={studios}
        onClose={() => setCopying(null)}
        onSubmit={async (src, v) => {
          const copy = await duplicate.mutateAsync({ id: src.id, title: v.title, studioId: v.studioId });
          setCopying(null);
          toast.show({
            text: `Made “${copy.title}” in ${copy.studioName}.`,
            actions: [
              { label: 'Open', onPress: () => open(copy.id) },
              { label: 'Undo', onPress: () => remove.mutate(copy.id, { onError: failed('Undo') }) },
            ],
          });
        }}
      />
      <ConfirmDeleteDialog setup={deleting} onClose={() => setDeleting(null)} onConfirm={deleteNow} />
      <Toast message={toast.message} onDone={toast.hide} />
    </View>
  );
}

/** What an empty section means, and what to do next. */
function EmptyLibrary({ section, filtering, onNew, onTemplates, onClear }: { section: LibrarySection; filtering: boolean; onNew: () => void; onTemplates: () => void; onClear: () => void }) {
  if (filtering) {
    return (
      <Card>
        <Text style={s.emptyTitle}>No setup matches that search</Text>
        <Body dim>Try another word from the title, the notes or a tag — a part of a word is enough.</Body>
        <View style={s.emptyActions}>
          <Button label="Clear the search" kind="quiet" onPress={onClear} />
        </View>
      </Card>
    );
  }
  if (section === 'templates') {
    return (
      <Card>
        <Text style={s.emptyTitle}>No templates yet</Text>
        <Body dim>Templates are setups a studio owner shares with everyone. When one is published it shows here, ready to copy into your own studio.</Body>
      </Card>
    );
  }
  if (section === 'deleted') {
    return (
      <Card>
        <Text style={s.emptyTitle}>Nothing deleted</Text>
        <Body dim>A deleted setup waits here for 30 days, so it can be restored with its history, then it is gone for good.</Body>
      </Card>
    );
  }
  return (
    <Card>
      <Text style={s.emptyTitle}>No setups yet</Text>
      <Body dim>A setup is one lighting plan with its notes, steps and shot list. Start one for your next shoot, or copy a template to learn from.</Body>
      <View style={s.emptyActions}>
        <Button label="Start a setup" onPress={onNew} testID="empty-new" />
        <Button label="Browse templates" kind="quiet" onPress={onTemplates} />
      </View>
    </Card>
  );
}

const s = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  head: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.sm, gap: space.sm },
  titleRow: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'flex-start', gap: space.md },
  search: {
    color: colours.text,
    fontFamily: fonts.sans,
    fontSize: 16,
    backgroundColor: colours.panel,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colours.line,
    paddingHorizontal: space.md,
    minHeight: 44,
  },
  controls: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, justifyContent: 'space-between' },
  list: { padding: space.lg, paddingTop: space.sm, paddingBottom: 96 },
  emptyTitle: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17, marginBottom: 4 },
  emptyActions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.md },
});
