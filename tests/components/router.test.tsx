// Proves expo-router's hooks and links work under the harness (the web flavour, links as real links), with
// expo-router's in-memory routes (a tiny screen per route, defined here): the app's screens can be tested the same way.
import { Link, useLocalSearchParams, usePathname, useRouter } from 'expo-router';
import { fireEvent, screen } from '@testing-library/react';
import { Text, View } from 'react-native';
import { Button } from '../../components/ui';
import { renderRouter } from './support/router';

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
    const router = renderRouter(routes, { initialUrl: '/' });
    expect(screen.getByText('showing /')).toBeInTheDocument();
    expect(router.getPathname()).toBe('/');
  });

  it('follows a Link to a dynamic route and reads its param', () => {
    const router = renderRouter(routes, { initialUrl: '/' });
    // On the web a Link is a real link, with the address a browser would open.
    const link = screen.getByRole('link', { name: 'Key and fill' });
    expect(link).toHaveAttribute('href', '/setups/key-and-fill');
    fireEvent.click(link);
    expect(screen.getByText('setup key-and-fill')).toBeInTheDocument();
    expect(router.getPathname()).toBe('/setups/key-and-fill');
  });

  it('navigates with useRouter, carries search params, and goes back', () => {
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
