// Presentation mode: the lesson player full screen with large type for a projector; arrows step, Esc leaves.
import { useRouter } from 'expo-router';
import { useCallback } from 'react';
import { Pressable, Text, View } from 'react-native';
import { colours, fonts, space } from '../../constants/theme';
import { useLesson } from '../../hooks/classes';
import { useMe } from '../../hooks/me';
import { usePageTitle } from '../../hooks/pageTitle';
import { Loading } from '../Loading';
import { LessonPlayer } from './LessonPlayer';
import { Back, NotFound } from './parts';

export function Presentation({ lessonId }: { lessonId: string }) {
  const router = useRouter();
  const me = useMe();
  const lesson = useLesson(lessonId);
  usePageTitle(lesson.data ? `${lesson.data.title}, presented` : null);
  const exit = useCallback(() => router.replace(`/lessons/${lessonId}`), [router, lessonId]);
  if (lesson.isError) return <NotFound what="Lesson" back={<Back href="/classes" label="Classes" />} />;
  if (!lesson.data) return <Loading />;
  const header = (
    <View style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', paddingHorizontal: space.xl, paddingTop: space.lg, gap: space.md }}>
      <Text style={{ color: colours.textDim, fontFamily: fonts.sansMedium, fontSize: 20, flexShrink: 1 }} numberOfLines={1} role="heading" aria-level={1}>
        {lesson.data.className} · {lesson.data.title}
      </Text>
      <Pressable accessibilityRole="button" onPress={exit} style={{ padding: space.sm }}>
        {/* The visible words are the button's name (a speech-input user says what they see). */}
        <Text style={{ color: colours.textDim, fontFamily: fonts.sans, fontSize: 16 }}>Leave presentation mode (Esc) · ← → to step</Text>
      </Pressable>
    </View>
  );
  return <LessonPlayer lesson={lesson.data} units={me.data?.user.units ?? 'metric'} present onExit={exit} header={header} />;
}
