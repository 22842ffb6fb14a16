import { SetupLibrary } from '../../../components/SetupLibrary';

export default function SetupsScreen() {
  return <SetupLibrary />;
}
