// Classes, lessons, assignments and submissions on the server: the query-key factory, the query hooks, and
// mutations that update the cache and invalidate what they touched. Documents in answers are parsed (and
// migrated) with the shared schema, as the setups hooks do.
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type {
  AssignmentDetail,
  AssignmentSummary,
  AssignmentWork,
  ClassInvitation,
  ClassListResponse,
  ClassMember,
  ClassView,
  CreateAssignmentBody,
  InviteToClassBody,
  JoinedClass,
  LessonDetail,
  LessonSetup,
  LessonSummary,
  SetupDetail,
  SubmissionComment,
  SubmissionCommentBody,
  SubmissionDetail,
  SubmissionSummary,
  UpdateAssignmentBody,
  UpdateLessonBody,
  UpdateLessonSetupBody,
} from '../model/api';
import { parseDocument } from '../model/document';
import { api } from './api';
import { meKeys } from './me';

export const classKeys = {
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
  return useQuery({ queryKey: classKeys.list(), queryFn: ({ signal }) => api<ClassListResponse>('/classes', { signal }) });
}

export function useClass(id: string) {
  return useQuery({ queryKey: classKeys.detail(id), queryFn: ({ signal }) => api<ClassView>(`/classes/${id}`, { signal }) });
}

function classesChanged(qc: QueryClient) {
  void qc.invalidateQueries({ queryKey: classKeys.list() });
  void qc.invalidateQueries({ queryKey: meKeys.all });
}

export function useCreateClass() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { name: string }) => api<ClassView>('/classes', { method: 'POST', body }),
    onSuccess: (c) => {
      qc.setQueryData(classKeys.detail(c.id), c);
      classesChanged(qc);
    },
  });
}

export function useJoinClass() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (body: { code: string }) => api<JoinedClass>('/classes/join', { method: 'POST', body }), onSuccess: () => classesChanged(qc) });
}

export function useAcceptClassInvitation() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: (classId: string) => api<JoinedClass>(`/classes/${classId}/accept`, { method: 'POST' }), onSuccess: () => classesChanged(qc) });
}

export function useNewJoinCode(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<{ joinCode: string }>(`/classes/${classId}/join-code`, { method: 'POST' }),
    onSuccess: ({ joinCode }) => qc.setQueryData<ClassView>(classKeys.detail(classId), (c) => (c ? { ...c, joinCode } : c)),
  });
}

export function useClassMembers(classId: string) {
  return useQuery({ queryKey: classKeys.members(classId), queryFn: ({ signal }) => api<{ members: ClassMember[] }>(`/classes/${classId}/members`, { signal }).then((r) => r.members) });
}

export function useRemoveClassMember(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => api<void>(`/classes/${classId}/members/${userId}`, { method: 'DELETE' }),
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
    queryFn: ({ signal }) => api<{ invitations: ClassInvitation[] }>(`/classes/${classId}/invitations`, { signal }).then((r) => r.invitations),
  });
}

export function useInviteToClass(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteToClassBody) => api<ClassInvitation>(`/classes/${classId}/invitations`, { method: 'POST', body }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: classKeys.invitations(classId) }),
  });
}

export function useWithdrawClassInvitation(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => api<void>(`/classes/${classId}/invitations/${id}`, { method: 'DELETE' }),
    onSettled: () => void qc.invalidateQueries({ queryKey: classKeys.invitations(classId) }),
  });
}

// ---------------------------------------------------------------------------------------------
// Lessons

export function useLessons(classId: string) {
  return useQuery({ queryKey: classKeys.lessons(classId), queryFn: ({ signal }) => api<{ lessons: LessonSummary[] }>(`/classes/${classId}/lessons`, { signal }).then((r) => r.lessons) });
}

export function useCreateLesson(classId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { title: string; summary?: string }) => api<LessonSummary>(`/classes/${classId}/lessons`, { method: 'POST', body }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: classKeys.lessons(classId) });
      void qc.invalidateQueries({ queryKey: classKeys.detail(classId) });
    },
  });
}

export function useLesson(id: string) {
  return useQuery({ queryKey: classKeys.lesson(id), queryFn: ({ signal }) => api<LessonDetail>(`/lessons/${id}`, { signal }).then(lessonIn) });
}

function lessonChanged(qc: QueryClient, l: { id: string; classId: string }) {
  void qc.invalidateQueries({ queryKey: classKeys.lesson(l.id) });
  void qc.invalidateQueries({ queryKey: classKeys.lessons(l.classId) });
}

export function useUpdateLesson(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateLessonBody) => api<LessonDetail>(`/lessons/${lesson.id}`, { method: 'PATCH', body }).then(lessonIn),
    onSuccess: (l) => {
      qc.setQueryData(classKeys.lesson(lesson.id), l);
      lessonChanged(qc, lesson);
    },
  });
}

export function useDeleteLesson(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>(`/lessons/${lesson.id}`, { method: 'DELETE' }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: classKeys.lesson(lesson.id) });
      void qc.invalidateQueries({ queryKey: classKeys.lessons(lesson.classId) });
    },
  });
}

export function useAddLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { setupId: string; note?: string }) => api<LessonSetup>(`/lessons/${lesson.id}/setups`, { method: 'POST', body }),
    onSuccess: () => lessonChanged(qc, lesson),
  });
}

/** Change a lesson setup's words or place; the cached lesson shows the change at once. */
export function useUpdateLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, ...body }: UpdateLessonSetupBody & { entryId: string }) => api<LessonSetup>(`/lessons/${lesson.id}/setups/${entryId}`, { method: 'PATCH', body }),
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
    mutationFn: (entryId: string) => api<LessonSetup>(`/lessons/${lesson.id}/setups/${entryId}/refresh`, { method: 'POST' }),
    onSettled: () => lessonChanged(qc, lesson),
  });
}

export function useRemoveLessonSetup(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (entryId: string) => api<void>(`/lessons/${lesson.id}/setups/${entryId}`, { method: 'DELETE' }),
    onSettled: () => lessonChanged(qc, lesson),
  });
}

// ---------------------------------------------------------------------------------------------
// Assignments, working copies and submissions

export function useClassAssignments(classId: string) {
  return useQuery({
    queryKey: classKeys.assignments(classId),
    queryFn: ({ signal }) => api<{ assignments: AssignmentSummary[] }>(`/classes/${classId}/assignments`, { signal }).then((r) => r.assignments),
  });
}

export function useAssignment(id: string) {
  return useQuery({ queryKey: classKeys.assignment(id), queryFn: ({ signal }) => api<AssignmentDetail>(`/assignments/${id}`, { signal }).then(assignmentIn) });
}

export function useCreateAssignment(lesson: { id: string; classId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateAssignmentBody) => api<AssignmentDetail>(`/lessons/${lesson.id}/assignments`, { method: 'POST', body }).then(assignmentIn),
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
    mutationFn: (body: UpdateAssignmentBody) => api<AssignmentDetail>(`/assignments/${a.id}`, { method: 'PATCH', body }).then(assignmentIn),
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
    mutationFn: (from: 'reference' | 'blank') => api<AssignmentWork>(`/assignments/${id}/start`, { method: 'POST', body: { from } }),
    onSuccess: (mine) => qc.setQueryData<AssignmentDetail>(classKeys.assignment(id), (a) => (a ? { ...a, mine } : a)),
  });
}

export function useSubmissions(assignmentId: string) {
  return useQuery({
    queryKey: classKeys.submissions(assignmentId),
    queryFn: ({ signal }) => api<{ submissions: SubmissionSummary[] }>(`/assignments/${assignmentId}/submissions`, { signal }).then((r) => r.submissions),
  });
}

export function useSubmit(assignmentId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<SubmissionDetail>(`/assignments/${assignmentId}/submissions`, { method: 'POST', body: {} }).then(submissionIn),
    onSuccess: (s) => {
      qc.setQueryData(classKeys.submission(s.id), s);
      void qc.invalidateQueries({ queryKey: classKeys.assignment(assignmentId) });
      void qc.invalidateQueries({ queryKey: classKeys.submissions(assignmentId) });
    },
  });
}

export function useSubmission(id: string) {
  return useQuery({ queryKey: classKeys.submission(id), queryFn: ({ signal }) => api<SubmissionDetail>(`/submissions/${id}`, { signal }).then(submissionIn) });
}

export function useReviewSubmission(s: { id: string; assignmentId: string }) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { reviewed?: boolean; shared?: boolean }) => api<SubmissionDetail>(`/submissions/${s.id}`, { method: 'PATCH', body }).then(submissionIn),
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
    mutationFn: (body: SubmissionCommentBody) => api<SubmissionComment>(`/submissions/${id}/comments`, { method: 'POST', body }),
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
    queryFn: ({ signal }) => api<SetupDetail>(`/setups/${setupId}`, { signal }).then(withDoc),
  });
}
