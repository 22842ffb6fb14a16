// Signed-out screens; a signed-in visitor goes straight to their setups.
import { Redirect, Slot } from 'expo-router';
import { Loading } from '../../components/Loading';
import { useSession } from '../../hooks/auth';

export default function AuthLayout() {
  const { data, isPending } = useSession();
  if (isPending) return <Loading />;
  if (data) return <Redirect href="/setups" />;
  return <Slot />;
}
