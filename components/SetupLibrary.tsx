// The Setups library: the setups the user may open, newest first, with search as you type.
import { useEffect, useMemo, useState } from 'react';
import { ActivityIndicator, FlatList, StyleSheet, Text, TextInput, View, useWindowDimensions } from 'react-native';
import { TABLET_MIN, WIDE_MIN, colours, fonts, radius, space } from '../constants/theme';
import { useSetupList } from '../hooks/setups';
import type { SetupSummary } from '../model/api';
import { Body, Card, ErrorText, Title } from './ui';

function useDebounced<T>(value: T, ms: number): T {
  const [v, setV] = useState(value);
  useEffect(() => {
    const t = setTimeout(() => setV(value), ms);
    return () => clearTimeout(t);
  }, [value, ms]);
  return v;
}

export function SetupLibrary() {
  const { width } = useWindowDimensions();
  const columns = width >= WIDE_MIN + 300 ? 3 : width >= TABLET_MIN ? 2 : 1;
  // A short last row keeps the column width instead of stretching.
  const maxCardWidth: `${number}%` = columns > 1 ? `${Math.floor(1000 / columns) / 10 - 1}%` : '100%';
  const [text, setText] = useState('');
  const q = useDebounced(text.trim(), 250);
  const list = useSetupList(q ? { q } : {});
  const setups = useMemo(() => list.data?.pages.flatMap((p) => p.setups) ?? [], [list.data]);

  return (
    <View style={s.root}>
      <View style={s.head}>
        <Title>Setups</Title>
        <TextInput
          value={text}
          onChangeText={setText}
          placeholder="Search titles and notes"
          placeholderTextColor={colours.textFaint}
          accessibilityLabel="Search setups"
          style={s.search}
        />
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
          keyExtractor={(s) => s.id}
          contentContainerStyle={s.list}
          columnWrapperStyle={columns > 1 ? { gap: space.md } : undefined}
          renderItem={({ item }) => <SetupCard setup={item} maxWidth={maxCardWidth} />}
          onEndReached={() => list.hasNextPage && !list.isFetchingNextPage && list.fetchNextPage()}
          ListEmptyComponent={<EmptyLibrary searching={q.length > 0} />}
          accessibilityLabel="Your setups"
        />
      )}
    </View>
  );
}

function SetupCard({ setup, maxWidth }: { setup: SetupSummary; maxWidth: `${number}%` }) {
  const updated = new Date(setup.updatedAt);
  return (
    <Card style={{ flex: 1, maxWidth, marginBottom: space.md }}>
      <View accessible accessibilityRole="summary" accessibilityLabel={setup.title} testID="setup-card">
        <Text style={s.cardTitle}>{setup.title}</Text>
        <Body dim>
          {setup.studioName}
          {setup.isTemplate ? ' · template' : ''}
        </Body>
        <View style={s.tags}>
          {setup.tags.map((t) => (
            <Text key={t} style={s.tag}>
              {t}
            </Text>
          ))}
        </View>
        <Text style={s.meta}>
          {setup.itemCount} items · updated {updated.toLocaleDateString()}
        </Text>
      </View>
    </Card>
  );
}

function EmptyLibrary({ searching }: { searching: boolean }) {
  return (
    <Card>
      <Text style={s.cardTitle}>{searching ? 'No setup matches that search' : 'No setups yet'}</Text>
      <Body dim>
        {searching
          ? 'Try another word from the title or the notes.'
          : 'A setup is one lighting plan with its notes, steps and shot list. Start one for your next shoot, or copy a template to learn from.'}
      </Body>
    </Card>
  );
}

const s = StyleSheet.create({
  root: { flex: 1, backgroundColor: colours.graphite },
  head: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.sm },
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
  list: { padding: space.lg, paddingTop: space.sm },
  cardTitle: { color: colours.text, fontFamily: fonts.sansBold, fontSize: 17, marginBottom: 4 },
  tags: { flexDirection: 'row', flexWrap: 'wrap', gap: 6, marginTop: space.sm },
  tag: { color: colours.cool, fontFamily: fonts.mono, fontSize: 12, borderWidth: 1, borderColor: colours.line, borderRadius: 999, paddingHorizontal: 8, paddingVertical: 2 },
  meta: { color: colours.textFaint, fontFamily: fonts.mono, fontSize: 12, marginTop: space.sm },
});
