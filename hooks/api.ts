// The one way the client talks to the API: same origin, cookies included, JSON both ways (a FormData body
// goes as multipart). Every route the client calls is in `routes` below, with its method, path, request
// body (typed from the shared zod schemas in model/api.ts), query and response type; hooks call
// `call('routeName', { params, body, query })` and get the route's response type. Errors arrive as
// ApiRequestError carrying the server's { code, message, fields }.
import type { z } from 'zod';
import type * as A from '../model/api';

export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields: Record<string, string> = {},
    readonly body: unknown = null,
  ) {
    super(message);
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
type Route<P extends string, Res, Body, Query> = { method: Method; path: P; types?: { res: Res; body: Body; query: Query } };
/** A route answering `Res`, taking `Body` (undefined: no body) and `Query` (undefined: no query). */
const route =
  <Res, Body = undefined, Query = undefined>() =>
  <P extends string>(method: Method, path: P): Route<P, Res, Body, Query> => ({ method, path });

type In<S extends z.ZodType> = z.input<S>;
type ListSetupsQuery = { studio?: string; q?: string; tag?: string; sort?: A.SetupSort; templates?: 1; deleted?: 1; cursor?: string };

const routes = {
  // Setups, history and comments
  listSetups: route<A.SetupListResponse, undefined, ListSetupsQuery>()('GET', '/setups'),
  listTags: route<{ tags: A.TagCount[] }, undefined, { studio?: string }>()('GET', '/tags'),
  getSetup: route<A.SetupDetail>()('GET', '/setups/:id'),
  createSetup: route<A.SetupDetail, In<typeof A.createSetupBody>>()('POST', '/setups'),
  updateSetup: route<A.SetupSaved, In<typeof A.updateSetupBody>>()('PUT', '/setups/:id'),
  duplicateSetup: route<A.SetupDetail, In<typeof A.duplicateSetupBody>>()('POST', '/setups/:id/duplicate'),
  /** Operators only: publish a template to, or withdraw it from, the gallery for everyone. */
  setForEveryone: route<A.ForEveryoneResponse, In<typeof A.forEveryoneBody>>()('PUT', '/setups/:id/everyone'),
  deleteSetup: route<void>()('DELETE', '/setups/:id'),
  restoreSetup: route<A.SetupDetail>()('POST', '/setups/:id/restore'),
  setupHistory: route<A.HistoryResponse, undefined, { before?: number }>()('GET', '/setups/:id/history'),
  restoreVersion: route<A.SetupSaved, { version?: number }>()('POST', '/setups/:id/history/:versionId/restore'),
  listComments: route<A.CommentsResponse>()('GET', '/setups/:id/comments'),
  addComment: route<A.SetupComment, In<typeof A.commentBody>>()('POST', '/setups/:id/comments'),
  resolveComment: route<A.SetupComment, In<typeof A.resolveCommentBody>>()('PATCH', '/setups/:id/comments/:commentId'),
  markCommentsRead: route<void>()('POST', '/setups/:id/comments/read'),
  // Photos, share links, sending to the crew
  listPhotos: route<{ photos: A.SetupPhoto[] }>()('GET', '/setups/:id/photos'),
  uploadPhoto: route<A.SetupPhoto, FormData>()('POST', '/setups/:id/photos'),
  deletePhoto: route<void>()('DELETE', '/setups/:id/photos/:photoId'),
  listShares: route<{ shares: A.ShareLink[] }>()('GET', '/setups/:id/shares'),
  createShare: route<A.ShareCreated, In<typeof A.createShareBody>>()('POST', '/setups/:id/shares'),
  revokeShare: route<void>()('DELETE', '/setups/:id/shares/:shareId'),
  sharedSetup: route<A.SharedSetup>()('GET', '/shared/:token'),
  sharedMembership: route<A.ShareMembership>()('GET', '/shared/:token/membership'),
  sendToCrew: route<A.SendToCrewResult, In<typeof A.sendToCrewBody>>()('POST', '/setups/:id/send'),
  // Account
  /** better-auth's own route, read without its client (hooks/session.ts). */
  getSession: route<A.SessionResponse>()('GET', '/auth/get-session'),
  me: route<A.Me>()('GET', '/me'),
  updateMe: route<A.Me, In<typeof A.updateMeBody>>()('PATCH', '/me'),
  // Studios and invitations
  listStudios: route<{ studios: A.StudioView[] }>()('GET', '/studios'),
  getStudio: route<A.StudioView>()('GET', '/studios/:id'),
  createStudio: route<A.StudioView, In<typeof A.createStudioBody>>()('POST', '/studios'),
  renameStudio: route<A.StudioView, In<typeof A.updateStudioBody>>()('PATCH', '/studios/:id'),
  studioMembers: route<{ members: A.StudioMember[] }>()('GET', '/studios/:id/members'),
  inviteMember: route<A.InvitationCreated, In<typeof A.inviteMemberBody>>()('POST', '/studios/:id/members'),
  changeMemberRole: route<{ members: A.StudioMember[] }, In<typeof A.updateMemberBody>>()('PATCH', '/studios/:id/members/:userId'),
  removeMember: route<void>()('DELETE', '/studios/:id/members/:userId'),
  studioInvitations: route<{ invitations: A.StudioInvitation[] }>()('GET', '/studios/:id/invitations'),
  cancelStudioInvitation: route<void>()('DELETE', '/studios/:id/invitations/:invitationId'),
  myInvitation: route<{ invitation: (A.InvitationPreview & { token: string }) | null }>()('GET', '/invitations'),
  dismissInvitation: route<void>()('DELETE', '/invitations'),
  invitationPreview: route<A.InvitationPreview>()('GET', '/invitations/:token'),
  acceptInvitation: route<{ studioId: string; role: A.StudioRole }>()('POST', '/invitations/:token/accept'),
  // Classes, lessons, assignments, submissions
  listClasses: route<A.ClassListResponse>()('GET', '/classes'),
  getClass: route<A.ClassView>()('GET', '/classes/:id'),
  createClass: route<A.ClassView, In<typeof A.createClassBody>>()('POST', '/classes'),
  joinClass: route<A.JoinedClass, In<typeof A.joinClassBody>>()('POST', '/classes/join'),
  acceptClass: route<A.JoinedClass>()('POST', '/classes/:id/accept'),
  newJoinCode: route<{ joinCode: string }>()('POST', '/classes/:id/join-code'),
  classMembers: route<{ members: A.ClassMember[] }>()('GET', '/classes/:id/members'),
  removeClassMember: route<void>()('DELETE', '/classes/:id/members/:userId'),
  classInvitations: route<{ invitations: A.ClassInvitation[] }>()('GET', '/classes/:id/invitations'),
  inviteToClass: route<A.ClassInvitation, In<typeof A.inviteToClassBody>>()('POST', '/classes/:id/invitations'),
  cancelClassInvitation: route<void>()('DELETE', '/classes/:id/invitations/:invitationId'),
  classLessons: route<{ lessons: A.LessonSummary[] }>()('GET', '/classes/:id/lessons'),
  createLesson: route<A.LessonSummary, In<typeof A.createLessonBody>>()('POST', '/classes/:id/lessons'),
  classAssignments: route<{ assignments: A.AssignmentSummary[] }>()('GET', '/classes/:id/assignments'),
  getLesson: route<A.LessonDetail>()('GET', '/lessons/:id'),
  updateLesson: route<A.LessonDetail, In<typeof A.updateLessonBody>>()('PATCH', '/lessons/:id'),
  deleteLesson: route<void>()('DELETE', '/lessons/:id'),
  addLessonSetup: route<A.LessonSetup, In<typeof A.addLessonSetupBody>>()('POST', '/lessons/:id/setups'),
  updateLessonSetup: route<A.LessonSetup, In<typeof A.updateLessonSetupBody>>()('PATCH', '/lessons/:id/setups/:entryId'),
  refreshLessonSetup: route<A.LessonSetup>()('POST', '/lessons/:id/setups/:entryId/refresh'),
  removeLessonSetup: route<void>()('DELETE', '/lessons/:id/setups/:entryId'),
  createAssignment: route<A.AssignmentDetail, In<typeof A.createAssignmentBody>>()('POST', '/lessons/:id/assignments'),
  getAssignment: route<A.AssignmentDetail>()('GET', '/assignments/:id'),
  updateAssignment: route<A.AssignmentDetail, In<typeof A.updateAssignmentBody>>()('PATCH', '/assignments/:id'),
  startAssignment: route<A.AssignmentWork, In<typeof A.startAssignmentBody>>()('POST', '/assignments/:id/start'),
  listSubmissions: route<{ submissions: A.SubmissionSummary[] }>()('GET', '/assignments/:id/submissions'),
  submit: route<A.SubmissionDetail, In<typeof A.submitBody>>()('POST', '/assignments/:id/submissions'),
  getSubmission: route<A.SubmissionDetail>()('GET', '/submissions/:id'),
  updateSubmission: route<A.SubmissionDetail, In<typeof A.updateSubmissionBody>>()('PATCH', '/submissions/:id'),
  addSubmissionComment: route<A.SubmissionComment, In<typeof A.submissionCommentBody>>()('POST', '/submissions/:id/comments'),
} as const;

type Routes = typeof routes;
export type RouteName = keyof Routes;
type ParamNames<P extends string> = P extends `${string}:${infer N}/${infer Rest}` ? N | ParamNames<`/${Rest}`> : P extends `${string}:${infer N}` ? N : never;
type Parts<R> = R extends Route<infer P, unknown, infer B, infer Q>
  ? ([ParamNames<P>] extends [never] ? unknown : { params: Record<ParamNames<P>, string> }) &
      ([B] extends [undefined] ? unknown : { body: B }) &
      ([Q] extends [undefined] ? unknown : { query?: Q })
  : never;
export type CallArgs<K extends RouteName> = Parts<Routes[K]> & { signal?: AbortSignal; /** Outlives the page (a save at page close). */ keepalive?: boolean; /** Extra request headers (a save's Idempotency-Key). */ headers?: Record<string, string> };
export type ResponseOf<K extends RouteName> = Routes[K] extends Route<string, infer Res, unknown, unknown> ? Res : never;

/** The URL of a route with its path parameters and query filled in. */
function urlOf(path: string, params: Record<string, string> = {}, query: Record<string, unknown> = {}): string {
  const filled = path.replace(/:([A-Za-z]+)/g, (_m, name: string) => {
    const v = params[name];
    if (v === undefined) throw new Error(`missing path parameter ${name} for ${path}`);
    return encodeURIComponent(v);
  });
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== '') q.set(k, String(v));
  const s = q.toString();
  return `/api${filled}${s ? `?${s}` : ''}`;
}

/** Call one route of the API by name. */
export async function call<K extends RouteName>(name: K, ...[args]: Record<string, never> extends Parts<Routes[K]> ? [CallArgs<K>?] : [CallArgs<K>]): Promise<ResponseOf<K>> {
  const r = routes[name];
  const a = (args ?? {}) as { params?: Record<string, string>; body?: unknown; query?: Record<string, unknown>; signal?: AbortSignal; keepalive?: boolean; headers?: Record<string, string> };
  const form = typeof FormData !== 'undefined' && a.body instanceof FormData;
  const res = await fetch(urlOf(r.path, a.params, a.query), {
    method: r.method,
    credentials: 'same-origin',
    headers: { ...(a.body !== undefined && !form ? { 'content-type': 'application/json' } : {}), ...a.headers },
    body: a.body === undefined ? undefined : form ? (a.body as FormData) : JSON.stringify(a.body),
    signal: a.signal,
    ...(a.keepalive ? { keepalive: true } : {}),
  });
  return (await readResponse(res)) as ResponseOf<K>;
}

/** A GET of a file the server makes (an export): the response itself, for reading its bytes as they come. */
export async function fetchFile(url: string, signal?: AbortSignal, init?: Pick<RequestInit, 'method' | 'headers' | 'body'>): Promise<Response> {
  const res = await fetch(url, { ...init, credentials: 'same-origin', signal });
  if (!res.ok) await readResponse(res);
  return res;
}

async function readResponse(res: Response): Promise<unknown> {
  if (res.status === 204) return undefined;
  const text = await res.text();
  let data: unknown = null;
  try {
    data = text ? (JSON.parse(text) as unknown) : null;
  } catch {
    if (res.ok) throw new ApiRequestError(res.status, 'bad_response', 'the server answered with something that is not JSON');
  }
  if (!res.ok) {
    const e = (data as A.ApiError | null)?.error;
    throw new ApiRequestError(res.status, e?.code ?? 'http_error', e?.message ?? `HTTP ${res.status}`, e?.fields ?? {}, data);
  }
  return data;
}
