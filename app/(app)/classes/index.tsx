import { ClassesScreen } from '../../../components/classes/ClassesScreen';

export default function ClassesRoute() {
  return <ClassesScreen />;
}
