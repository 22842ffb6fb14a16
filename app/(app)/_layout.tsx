// Signed-in screens inside the navigation frame; a signed-out visitor is sent to sign in.
import { Redirect, Slot } from 'expo-router';
import { Loading } from '../../components/Loading';
import { NavShell } from '../../components/NavShell';
import { useSession } from '../../hooks/auth';

export default function AppLayout() {
  const { data, isPending } = useSession();
  if (isPending) return <Loading />;
  if (!data) return <Redirect href="/sign-in" />;
  return (
    <NavShell>
      <Slot />
    </NavShell>
  );
}

// A deep link or reload on any signed-in screen keeps Setups as the screen below it.
export const unstable_settings = { initialRouteName: 'setups/index' };
