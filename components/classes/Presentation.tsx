// Presentation mode: the lesson player full screen with large type for a projector; arrows step, Esc leaves.
import { useRouter } from 'expo-router';
import { useCallback } from 'react';
import { Pressable, Text, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import { useLesson } from '../../hooks/classes';
import { useMe } from '../../hooks/me';
import { Loading } from '../Loading';
import { LessonPlayer } from './LessonPlayer';
import { Back, NotFound } from './parts';

export function Presentation({ lessonId }: { lessonId: string }) {
  const router = useRouter();
  const me = useMe();
  const lesson = useLesson(lessonId);
  const exit = useCallback(() => router.replace(`/lessons/${lessonId}`), [router, lessonId]);
  if (lesson.isError) return <NotFound what="Lesson" back={<Back href="/classes" label="Classes" />} />;
  if (!lesson.data) return <Loading />;
  const header = (
    <View style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', paddingHorizontal: space.xl, paddingTop: space.lg, gap: space.md }}>
      <Text style={{ color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 20, flexShrink: 1 }} numberOfLines={1}>
        {lesson.data.className} · {lesson.data.title}
      </Text>
      <Pressable accessibilityRole="button" accessibilityLabel="Leave presentation mode" onPress={exit} style={{ padding: space.sm }}>
        <Text style={{ color: colours.textDim, fontFamily: fonts.sans, fontSize: 16 }}>← → to step · Esc to leave</Text>
      </Pressable>
    </View>
  );
  return <LessonPlayer lesson={lesson.data} units={me.data?.user.units ?? 'metric'} present onExit={exit} header={header} />;
}
