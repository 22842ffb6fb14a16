// Units (metres or feet and inches) and the crew sheet's paper size.
import { Text, View } from 'react-native';
import { colours, fonts, space } from '../constants/theme';
import { useUpdateMe } from '../hooks/me';
import type { Me } from '../model/api';
import { ChoiceField } from './editor/fields';
import { Card } from './ui';

export function AccountSettings({ me }: { me: Me }) {
  const update = useUpdateMe();
  return (
    <Card>
      <Text style={{ color: colours.text, fontFamily: fonts.sansMedium, fontSize: 17, marginBottom: space.sm }}>Settings</Text>
      <View>
        <ChoiceField label="Units" value={me.user.units} options={[{ id: 'metric', label: 'metres' }, { id: 'imperial', label: 'feet and inches' }]} onChange={(units) => update.mutate({ units })} />
        <ChoiceField label="Crew sheet paper" value={me.user.paper} options={[{ id: 'a4', label: 'A4' }, { id: 'letter', label: 'US Letter' }]} onChange={(paper) => update.mutate({ paper })} />
      </View>
    </Card>
  );
}
