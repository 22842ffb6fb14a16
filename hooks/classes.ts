// Classes, lessons, assignments and submissions on the server: the query-key factory, the query hooks, and
// mutations that update the cache and invalidate what they touched. Documents in answers are parsed (and
// migrated) with the shared schema, as the setups hooks do.
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type {
  AssignmentDetail,
  ClassView,
  CreateAssignmentBody,
  UpdateAssignmentBody,
  InviteToClassBody,
  LessonDetail,
  SubmissionComment,
  SubmissionCommentBody,
  SubmissionDetail,
  UpdateLessonBody,
  UpdateLessonSetupBody,
} from '../model/api';
import { parseDocument } from '../model/document';
import { call } from './api';
import { meKeys } from './me';

const classKeys = {
  all: ['classes'] as const,
  list: () => [...classKeys.all, 'list'] as const,
  detail: (id: string) => [...classKeys.all, 'detail', id] as const,
  members: (id: string) => [...classKeys.all, 'members', id] as const,
  invitations: (id: string) => [...classKeys.all, 'invitations', id] as const,
  lessons: (id: string) => [...classKeys.all, 'lessons', id] as const,
  assignments: (id: string) => [...classKeys.all, 'assignments', id] as const,
  lesson: (id: string) => [...classKeys.all, 'lesson', id] as const,
  assignment: (id: string) => [...classKeys.all, 'assignment', id] as const,
  submissions: (assignmentId: string) => [...classKeys.all, 'submissions', assignmentId] as const,
  submission: (id: string) => [...classKeys.all, 'submission', id] as const,
};

const withDoc = <T extends { document: unknown }>(x: T) => ({ ...x, document: parseDocument(x.document) });
const lessonIn = (l: LessonDetail): LessonDetail => ({ ...l, setups: l.setups.map(withDoc) });
const assignmentIn = (a: AssignmentDetail): AssignmentDetail => ({ ...a, reference: a.reference ? withDoc(a.reference) : null });
const submissionIn = (s: SubmissionDetail): SubmissionDetail => ({ ...withDoc(s), reference: s.reference ? withDoc(s.reference) : null });

// ---------------------------------------------------------------------------------------------
// Classes and the roster

export function useClasses() {
  return useQuery({ queryKey: classKeys.list(), queryFn: ({ signal }) => call('listClasses', { signal }) });
}

export function useClass(id: string) {
  return useQuery({ queryKey: classKeys.detail(id), queryFn: ({ signal }) => call('getClass', { params: { id }, signal }) });
}

function classesChanged(qc: QueryClient) {
  void qc.invalidateQueries({ queryKey: classKeys.list() });
  void qc.invalidateQueries({ queryKey: meKeys.all });
}

export function useCreateClass() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string }) => call('createClass', { body }),
    onSuccess: (c) => {
      qc.setQueryData(classKeys.detail(c.id), c);
      classesChanged(qc);
    },
  });
}

export function useJoinClass() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: { code: string }) => call('joinClass', { body }), onSuccess: () => classesChanged(qc) });
}

export function useAcceptClassInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (classId: string) => call('acceptClass', { params: { id: classId } }), onSuccess: () => classesChanged(qc) });
}

export function useNewJoinCode(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => call('newJoinCode', { params: { id: classId } }),
    onSuccess: ({ joinCode }) => qc.setQueryData<ClassView>(classKeys.detail(classId), (c) => (c ? { ...c, joinCode } : c)),
  });
}

export function useClassMembers(classId: string) {
  return useQuery({ queryKey: classKeys.members(classId), queryFn: ({ signal }) => call('classMembers', { params: { id: classId }, signal }).then((r) => r.members) });
}

export function useRemoveClassMember(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => call('removeClassMember', { params: { id: classId, userId } }),
    onSettled: () => {
      void qc.invalidateQueries({ queryKey: classKeys.members(classId) });
      void qc.invalidateQueries({ queryKey: classKeys.detail(classId) });
      classesChanged(qc);
    },
  });
}

export function useClassInvitations(classId: string, enabled: boolean) {
  return useQuery({
    queryKey: classKeys.invitations(classId),
    enabled,
    queryFn: ({ signal }) => call('classInvitations', { params: { id: classId }, signal }).then((r) => r.invitations),
  });
}

export function useInviteToClass(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteToClassBody) => call('inviteToClass', { params: { id: classId }, body }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: classKeys.invitations(classId) }),
  });
}

export function useWithdrawClassInvitation(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => call('cancelClassInvitation', { params: { id: classId, invitationId: id } }),
    onSettled: () => void qc.invalidateQueries({ queryKey: classKeys.invitations(classId) }),
  });
}

// ---------------------------------------------------------------------------------------------
// Lessons

export function useLessons(classId: string) {
  return useQuery({ queryKey: classKeys.lessons(classId), queryFn: ({ signal }) => call('classLessons', { params: { id: classId }, signal }).then((r) => r.lessons) });
}

export function useCreateLesson(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { title: string; summary?: string }) => call('createLesson', { params: { id: classId }, body }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: classKeys.lessons(classId) });
      void qc.invalidateQueries({ queryKey: classKeys.detail(classId) });
    },
  });
}

export function useLesson(id: string) {
  return useQuery({ queryKey: classKeys.lesson(id), queryFn: ({ signal }) => call('getLesson', { params: { id }, signal }).then(lessonIn) });
}

function lessonChanged(qc: QueryClient, l: { id: string; classId: string }) {
  void qc.invalidateQueries({ queryKey: classKeys.lesson(l.id) });
  void qc.invalidateQueries({ queryKey: classKeys.lessons(l.classId) });
}

export function useUpdateLesson(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateLessonBody) => call('updateLesson', { params: { id: lesson.id }, body }).then(lessonIn),
    onSuccess: (l) => {
      qc.setQueryData(classKeys.lesson(lesson.id), l);
      lessonChanged(qc, lesson);
    },
  });
}

export function useDeleteLesson(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => call('deleteLesson', { params: { id: lesson.id } }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: classKeys.lesson(lesson.id) });
      void qc.invalidateQueries({ queryKey: classKeys.lessons(lesson.classId) });
    },
  });
}

export function useAddLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { setupId: string; note?: string }) => call('addLessonSetup', { params: { id: lesson.id }, body }),
    onSuccess: () => lessonChanged(qc, lesson),
  });
}

/** Change a lesson setup's words or place; the cached lesson shows the change at once. */
export function useUpdateLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, ...body }: UpdateLessonSetupBody & { entryId: string }) => call('updateLessonSetup', { params: { id: lesson.id, entryId }, body }),
    onMutate: async ({ entryId, note, stepNotes }) => {
      await qc.cancelQueries({ queryKey: classKeys.lesson(lesson.id) });
      const before = qc.getQueryData<LessonDetail>(classKeys.lesson(lesson.id));
      if (before) {
        qc.setQueryData<LessonDetail>(classKeys.lesson(lesson.id), {
          ...before,
          setups: before.setups.map((e) => (e.id === entryId ? { ...e, ...(note !== undefined ? { note } : {}), ...(stepNotes ? { stepNotes: { ...e.stepNotes, ...stepNotes } } : {}) } : e)),
        });
      }
      return { before };
    },
    onError: (_e, _b, ctx) => ctx?.before && qc.setQueryData(classKeys.lesson(lesson.id), ctx.before),
    onSettled: () => lessonChanged(qc, lesson),
  });
}

export function useRefreshLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (entryId: string) => call('refreshLessonSetup', { params: { id: lesson.id, entryId } }),
    onSettled: () => lessonChanged(qc, lesson),
  });
}

export function useRemoveLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (entryId: string) => call('removeLessonSetup', { params: { id: lesson.id, entryId } }),
    onSettled: () => lessonChanged(qc, lesson),
  });
}

// ---------------------------------------------------------------------------------------------
// Assignments, working copies and submissions

export function useClassAssignments(classId: string) {
  return useQuery({
    queryKey: classKeys.assignments(classId),
    queryFn: ({ signal }) => call('classAssignments', { params: { id: classId }, signal }).then((r) => r.assignments),
  });
}

export function useAssignment(id: string) {
  return useQuery({ queryKey: classKeys.assignment(id), queryFn: ({ signal }) => call('getAssignment', { params: { id }, signal }).then(assignmentIn) });
}

export function useCreateAssignment(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateAssignmentBody) => call('createAssignment', { params: { id: lesson.id }, body }).then(assignmentIn),
    onSuccess: (a) => {
      qc.setQueryData(classKeys.assignment(a.id), a);
      lessonChanged(qc, lesson);
      void qc.invalidateQueries({ queryKey: classKeys.assignments(lesson.classId) });
    },
  });
}

export function useUpdateAssignment(a: { id: string; classId: string; lessonId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateAssignmentBody) => call('updateAssignment', { params: { id: a.id }, body }).then(assignmentIn),
    onSuccess: (d) => {
      qc.setQueryData(classKeys.assignment(a.id), d);
      void qc.invalidateQueries({ queryKey: classKeys.assignments(a.classId) });
      void qc.invalidateQueries({ queryKey: classKeys.lesson(a.lessonId) });
    },
  });
}

export function useStartAssignment(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (from: 'reference' | 'blank') => call('startAssignment', { params: { id }, body: { from } }),
    onSuccess: (mine) => qc.setQueryData<AssignmentDetail>(classKeys.assignment(id), (a) => (a ? { ...a, mine } : a)),
  });
}

export function useSubmissions(assignmentId: string) {
  return useQuery({
    queryKey: classKeys.submissions(assignmentId),
    queryFn: ({ signal }) => call('listSubmissions', { params: { id: assignmentId }, signal }).then((r) => r.submissions),
  });
}

export function useSubmit(assignmentId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => call('submit', { params: { id: assignmentId }, body: {} }).then(submissionIn),
    onSuccess: (s) => {
      qc.setQueryData(classKeys.submission(s.id), s);
      void qc.invalidateQueries({ queryKey: classKeys.assignment(assignmentId) });
      void qc.invalidateQueries({ queryKey: classKeys.submissions(assignmentId) });
    },
  });
}

export function useSubmission(id: string) {
  return useQuery({ queryKey: classKeys.submission(id), queryFn: ({ signal }) => call('getSubmission', { params: { id }, signal }).then(submissionIn) });
}

export function useReviewSubmission(s: { id: string; assignmentId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { reviewed?: boolean; shared?: boolean }) => call('updateSubmission', { params: { id: s.id }, body }).then(submissionIn),
    onSuccess: (d) => {
      qc.setQueryData(classKeys.submission(s.id), d);
      void qc.invalidateQueries({ queryKey: classKeys.submissions(s.assignmentId) });
      void qc.invalidateQueries({ queryKey: classKeys.assignment(s.assignmentId) });
    },
  });
}

/** Comment on a submission's plan; the comment shows at once. */
export function useCommentOnSubmission(id: string, me: { id: string; name: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SubmissionCommentBody) => call('addSubmissionComment', { params: { id }, body }),
    onMutate: async (body) => {
      await qc.cancelQueries({ queryKey: classKeys.submission(id) });
      const before = qc.getQueryData<SubmissionDetail>(classKeys.submission(id));
      const draft: SubmissionComment = { id: `draft-${Date.now()}`, body: body.body, itemId: body.itemId ?? null, point: body.point ?? null, createdAt: new Date().toISOString(), author: me };
      if (before) qc.setQueryData<SubmissionDetail>(classKeys.submission(id), { ...before, comments: [...before.comments, draft], commentCount: before.commentCount + 1 });
      return { before };
    },
    onError: (_e, _b, ctx) => ctx?.before && qc.setQueryData(classKeys.submission(id), ctx.before),
    onSettled: () => void qc.invalidateQueries({ queryKey: classKeys.submission(id) }),
  });
}

/** A student's working copy as saved now (read fresh each time the assignment is opened, for the check). */
export function useWorkingCopy(setupId: string | null) {
  return useQuery({
    queryKey: [...classKeys.all, 'work', setupId ?? 'none'],
    enabled: !!setupId,
    staleTime: 0,
    refetchOnMount: 'always',
    refetchOnWindowFocus: true,
    queryFn: ({ signal }) => call('getSetup', { params: { id: setupId ?? '' }, signal }).then(withDoc),
  });
}
