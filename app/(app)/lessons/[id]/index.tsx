import { useLocalSearchParams } from 'expo-router';
import { LessonScreen } from '../../../../components/classes/LessonScreen';

export default function LessonRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <LessonScreen lessonId={id} />;
}
