import { useLocalSearchParams } from 'expo-router';
import { LessonBuilder } from '../../../../components/classes/LessonBuilder';

export default function LessonEditRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <LessonBuilder lessonId={id} />;
}
