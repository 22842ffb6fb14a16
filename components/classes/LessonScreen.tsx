// A lesson to follow: the player with a way back to the class, to presentation mode and (instructors) to
// editing the lesson.
import { useRouter } from 'expo-router';
import { Text, View } from 'react-native';
import { space } from '../../constants/theme';
import { useLesson } from '../../hooks/classes';
import { useMe } from '../../hooks/me';
import { Loading } from '../Loading';
import { Button } from '../ui';
import { LessonPlayer } from './LessonPlayer';
import { Back, NotFound, s } from './parts';
import { usePageTitle } from '../../hooks/pageTitle';

export function LessonScreen({ lessonId }: { lessonId: string }) {
  const router = useRouter();
  const me = useMe();
  const lesson = useLesson(lessonId);
  usePageTitle(lesson.isError ? 'Lesson not found' : lesson.data?.title);
  if (lesson.isError) return <NotFound what="Lesson" back={<Back href="/classes" label="Classes" />} />;
  if (!lesson.data) return <Loading />;
  const l = lesson.data;
  const header = (
    <View style={{ gap: space.sm }}>
      <Back href={`/classes/${l.classId}`} label={l.className} />
      <View style={[s.row, { justifyContent: 'space-between' }]}>
        <Text style={[s.title, { fontSize: 20, flexShrink: 1 }]} accessibilityRole="header">
          {l.title}
        </Text>
        <View style={s.row}>
          {l.role === 'instructor' ? <Button kind="quiet" label="Edit" onPress={() => router.push(`/lessons/${l.id}/edit`)} /> : null}
          <Button kind="quiet" label="Present" onPress={() => router.push(`/present/${l.id}`)} testID="present" />
        </View>
      </View>
    </View>
  );
  return <LessonPlayer lesson={l} units={me.data?.user.units ?? 'metric'} header={header} />;
}
