import { ScrollView } from 'react-native';
import { Body, Card, Title } from '../../../components/ui';
import { colours, space } from '../../../constants/theme';
import { useMe } from '../../../hooks/me';

export default function ClassesScreen() {
  const me = useMe();
  const classes = me.data?.classes ?? [];
  return (
    <ScrollView style={{ flex: 1, backgroundColor: colours.graphite }} contentContainerStyle={{ padding: space.lg, gap: space.md }}>
      <Title>Classes</Title>
      {classes.length === 0 ? (
        <Body dim>You are not in a class yet. An instructor can invite you, or give you a join code.</Body>
      ) : (
        classes.map((c) => (
          <Card key={c.id}>
            <Body style={{ fontSize: 17 }}>{c.name}</Body>
            <Body dim>{c.role === 'instructor' ? 'You teach this class' : 'You are a student'}</Body>
          </Card>
        ))
      )}
    </ScrollView>
  );
}
