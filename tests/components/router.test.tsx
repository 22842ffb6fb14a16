// Proves expo-router's hooks and links work under the harness, with expo-router's own in-memory router
// (a tiny screen per route, defined here): the app's screens can be tested the same way.
import { Link, useLocalSearchParams, usePathname, useRouter } from 'expo-router';
import { fireEvent, renderRouter, screen } from 'expo-router/testing-library';
import { Text, View } from 'react-native';
import { Button } from '../../components/ui';

function Library() {
  const router = useRouter();
  return (
    <View>
      <Text>showing {usePathname()}</Text>
      <Link href="/setups/key-and-fill">Key and fill</Link>
      <Button label="Open the rim light setup" onPress={() => router.push('/setups/rim-light?view=plan')} />
    </View>
  );
}

function SetupScreen() {
  const { id, view } = useLocalSearchParams<{ id: string; view?: string }>();
  const router = useRouter();
  return (
    <View>
      <Text>setup {id}</Text>
      <Text>view {view ?? 'default'}</Text>
      <Button label="Back" onPress={() => router.back()} />
    </View>
  );
}

const routes = { index: Library, 'setups/[id]': SetupScreen };

describe('expo-router under the harness', () => {
  it('renders the initial route with its pathname', () => {
    renderRouter(routes, { initialUrl: '/' });
    expect(screen.getByText('showing /')).toBeInTheDocument();
    expect(screen).toHavePathname('/');
  });

  it('follows a Link to a dynamic route and reads its param', () => {
    renderRouter(routes, { initialUrl: '/' });
    fireEvent.click(screen.getByText('Key and fill'));
    expect(screen.getByText('setup key-and-fill')).toBeInTheDocument();
    expect(screen).toHavePathname('/setups/key-and-fill');
  });

  it('navigates with useRouter, carries search params, and goes back', () => {
    // (Read the router's state directly: expo-router's structured matchers such as toHaveSearchParams
    // format their failure message with Jest's diff helper, whose signature vitest's does not share.)
    const router = renderRouter(routes, { initialUrl: '/' });
    fireEvent.click(screen.getByRole('button', { name: 'Open the rim light setup' }));
    expect(screen.getByText('setup rim-light')).toBeInTheDocument();
    expect(screen.getByText('view plan')).toBeInTheDocument();
    expect(router.getPathnameWithParams()).toBe('/setups/rim-light?view=plan');

    fireEvent.click(screen.getByRole('button', { name: 'Back' }));
    expect(screen.getByText('showing /')).toBeInTheDocument();
  });

  it('starts on a deep link', () => {
    renderRouter(routes, { initialUrl: '/setups/bounce-test' });
    expect(screen.getByText('setup bounce-test')).toBeInTheDocument();
    expect(screen.getByText('view default')).toBeInTheDocument();
  });
});
