import { Link } from 'expo-router';
import { View } from 'react-native';
import { Body, Title } from '../components/ui';
import { colours } from '../constants/theme';

export default function NotFound() {
  return (
    <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colours.graphite, padding: 24 }}>
      <Title>Nothing here</Title>
      <Link href="/">
        <Body style={{ color: colours.accent }}>Back to your setups</Body>
      </Link>
    </View>
  );
}

// A route that throws shows a way back (open editors save first).
export { RouteError as ErrorBoundary } from '../components/RouteError';
