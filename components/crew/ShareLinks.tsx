// Read-only links to the setup: owners and editors make and withdraw them; everyone in the studio sees which
// exist. A new link's address is shown once (only a hash of it is kept), with a button to copy it.
import { useState } from 'react';
import { Pressable, StyleSheet, Text, TextInput, View } from 'react-native';
import { colours, fonts, radius, space } from '../../constants/theme';
import { useCreateShare, useRevokeShare, useShares } from '../../hooks/shares';
import type { ShareCreated } from '../../model/api';
import { Body, Button, ErrorText } from '../ui';
import { copyText } from './download';
import { formatDate } from '../../model/format';

const when = (iso: string) => formatDate(iso);

export function ShareLinks({ setupId, canShare }: { setupId: string; canShare: boolean }) {
  const shares = useShares(setupId);
  const create = useCreateShare(setupId);
  const revoke = useRevokeShare(setupId);
  const [label, setLabel] = useState('');
  const [made, setMade] = useState<ShareCreated | null>(null);
  const [copied, setCopied] = useState<boolean | null>(null);

  const make = () =>
    create.mutate(
      { label: label.trim() || undefined },
      {
        onSuccess: (r) => {
          setMade(r);
          setLabel('');
          setCopied(null);
        },
      },
    );

  return (
    <View style={s.wrap}>
      <Text style={s.sub}>Read-only link</Text>
      <Body dim style={s.small}>
        Anyone with the link sees the plan, the kit and the crew sheet on their phone, without an account. They cannot change anything.
      </Body>
      {canShare ? (
        <View style={s.row}>
          <TextInput value={label} onChangeText={setLabel} placeholder="Who it is for (optional)" placeholderTextColor={colours.textFaint} accessibilityLabel="Link label" maxLength={80} style={s.input} />
          <Button label="Make a link" onPress={make} busy={create.isPending} testID="make-share-link" />
        </View>
      ) : null}
      {create.error ? <ErrorText>{create.error.message}</ErrorText> : null}
      {made ? (
        <View style={s.made} testID="share-link-made">
          <Text selectable style={s.url} testID="share-url">
            {made.url}
          </Text>
          <View style={s.row}>
            <Button label={copied ? 'Copied' : 'Copy link'} kind="quiet" onPress={() => void copyText(made.url).then(setCopied)} />
          </View>
          <Body dim style={s.small}>
            {copied === false ? 'Select the address above and copy it. ' : ''}This is the only time the whole address is shown; keep it or make another.
          </Body>
        </View>
      ) : null}
      {shares.data?.length ? (
        <View style={{ gap: 6 }}>
          {shares.data.map((l) => (
            <View key={l.id} style={s.link} testID="share-row">
              <View style={{ flex: 1 }}>
                <Text style={s.linkName} numberOfLines={1}>
                  {l.label || 'Link'} <Text style={s.tail}>…{l.tokenTail}</Text>
                </Text>
                <Text style={s.meta}>
                  {l.createdBy ? `${l.createdBy}, ` : ''}
                  {when(l.createdAt)} · {l.lastOpenedAt ? `last opened ${when(l.lastOpenedAt)}` : 'not opened yet'}
                </Text>
              </View>
              {canShare ? (
                <Pressable accessibilityRole="button" accessibilityLabel={`Withdraw ${l.label || 'link'} …${l.tokenTail}`} onPress={() => revoke.mutate(l.id)} style={s.withdraw}>
                  <Text style={s.withdrawText}>Withdraw</Text>
                </Pressable>
              ) : null}
            </View>
          ))}
        </View>
      ) : shares.isSuccess ? (
        <Body dim style={s.small}>
          No links yet.
        </Body>
      ) : null}
    </View>
  );
}

const s = StyleSheet.create({
  wrap: { gap: space.sm },
  sub: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 15 },
  small: { fontSize: 13, lineHeight: 18 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'center' },
  input: { flexGrow: 1, minWidth: 160, minHeight: 44, borderWidth: 1, borderColor: colours.line, borderRadius: radius.md, paddingHorizontal: space.md, color: colours.text, fontFamily: fonts.sans, fontSize: 15 },
  made: { gap: space.sm, padding: space.md, borderRadius: radius.md, backgroundColor: colours.panelRaised },
  url: { color: colours.accent, fontFamily: fonts.mono, fontSize: 13 },
  link: { flexDirection: 'row', alignItems: 'center', gap: space.sm, paddingVertical: 6, borderTopWidth: 1, borderTopColor: colours.line },
  linkName: { color: colours.text, fontFamily: fonts.sansMedium, fontSize: 14 },
  tail: { color: colours.textDim, fontFamily: fonts.mono, fontSize: 12 },
  meta: { color: colours.textDim, fontFamily: fonts.sans, fontSize: 12 },
  withdraw: { paddingHorizontal: space.md, minHeight: 40, justifyContent: 'center', borderRadius: radius.md, borderWidth: 1, borderColor: colours.line },
  withdrawText: { color: colours.danger, fontFamily: fonts.sansMedium, fontSize: 13 },
});
