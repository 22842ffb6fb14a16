// Teaching in Chromium. An instructor (wide screen) starts a class, builds a two-setup lesson from their
// setups with words for a step, publishes it, presents it with the arrow keys, and sets an assignment with
// a meter check. A student on a phone (390 × 844) joins with the code, follows the lesson step by step
// (the change line and the meter move with each step), starts from the reference, submits a plan that
// fails the check (a second light left on), switches that light off in the editor and passes. The
// instructor pins a comment to the student's key light and marks the plan reviewed; the student sees it.
// The two setups and the student's extra light are made through the API; everything else is the UI.
import { describe, expect, inject, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { dragSheet, settledBox, sharedBrowser, shot, viewports, watchErrors } from '../support/browser';
import { freshEmail } from '../support/http';

const base = inject('baseUrl');
const browser = sharedBrowser();
const word = `bokeh${Date.now().toString(36)}`;
const PASSWORD = 'e2e-classes-pass-1';

const room = [
  { id: 'paper', kind: 'wall', label: 'Grey paper', surface: 'seamless', a: { x: 2, y: 1 }, b: { x: 6, y: 1 }, heightM: 2.7, colour: '#808080' },
  { id: 'sitter', kind: 'subject', label: 'Sitter', x: 4, y: 3, facingDeg: 90, faceHeightM: 1.6 },
  { id: 'cam', kind: 'camera', label: 'Camera', x: 4, y: 5.6, heightM: 1.6, aimDeg: -90, iso: 100, aperture: 8, shutterS: 1 / 200 },
];
const key = { id: 'key', kind: 'light', label: 'Key', x: 4, y: 4, heightM: 2.2, aimDeg: -90, tiltDeg: -31, source: { type: 'strobe', energyWs: 400 }, power: 1 / 64, modifier: 'bare-reflector' };
const rim = { id: 'rim', kind: 'light', label: 'Rim', role: 'rim', x: 5.2, y: 2.2, heightM: 1.8, aimDeg: 146, tiltDeg: -5, source: { type: 'strobe', energyWs: 400 }, power: 1 / 8, modifier: 'strip', gridDeg: 30 };
const doc = (items: unknown[], steps: { id: string; title: string; note?: string; itemIds: string[] }[]) => ({ schemaVersion: 1, stage: { widthM: 8, depthM: 6 }, items, steps });

async function person(vp: keyof typeof viewports, name: string) {
  const context = await browser().newContext({ viewport: viewports[vp] });
  const email = freshEmail(name.split(' ')[0]!.toLowerCase());
  const r = await context.request.post(`${base}/api/auth/sign-up/email`, { data: { name, email, password: PASSWORD }, headers: { origin: base } });
  expect(r.status()).toBe(200);
  // A sign-up does not sign in (the address is confirmed by mail); joining by code needs no confirmation.
  expect((await context.request.post(`${base}/api/auth/sign-in/email`, { data: { email, password: PASSWORD }, headers: { origin: base } })).status()).toBe(200);
  const page = await context.newPage();
  return { context, page, email, errors: watchErrors(page), api: apiOf(context) };
}
const apiOf = (c: BrowserContext) => ({
  get: async (path: string) => (await c.request.get(`${base}/api${path}`)).json(),
  send: async (method: 'POST' | 'PUT', path: string, data: unknown) => {
    const r = await c.request.fetch(`${base}/api${path}`, { method, data, headers: { origin: base } });
    expect(r.ok(), await r.text()).toBe(true);
    return r.json();
  },
});

const text = (page: Page, testId: string) => page.getByTestId(testId).first().textContent();

async function centreOf(_page: Page, locator: ReturnType<Page['getByTestId']>) {
  const b = await settledBox(locator);
  return { x: b.x + b.width / 2, y: b.y + b.height / 2 };
}

describe('a class taught from saved setups', () => {
  it('builds a lesson, a student follows it on a phone, fails the check, fixes the plan, passes, and is reviewed', async () => {
    // ---- The instructor, on a wide screen ----
    const teacher = await person('wide', 'Rowan Teacher');
    const t = teacher.page;
    const paper = await teacher.api.send('POST', '/setups', {
      title: `Paper falloff ${word}`,
      document: doc([...room, key], [{ id: 'set', title: 'The set', itemIds: ['paper', 'sitter', 'cam'] }, { id: 'key-in', title: 'Key in front', itemIds: ['key'] }]),
    });
    await teacher.api.send('POST', '/setups', {
      title: `Rim then key ${word}`,
      document: doc([...room, rim, key], [{ id: 'rim-in', title: 'Rim from behind', itemIds: ['paper', 'sitter', 'cam', 'rim'] }, { id: 'key-in', title: 'Key in front', itemIds: ['key'] }]),
    });
    expect(paper.id).toBeTruthy();

    await t.goto(`${base}/classes`);
    await t.getByLabel('Class name').fill(`Flash basics ${word}`);
    await t.getByRole('button', { name: 'Start the class' }).click();
    await t.getByRole('link', { name: `Flash basics ${word}` }).click();
    await expect.poll(() => t.getByTestId('join-code').count(), { timeout: 10_000 }).toBe(1);
    const code = (await text(t, 'join-code'))!.trim();
    expect(code).toMatch(/^[A-Z2-9]{6}$/);
    const classId = t.url().split('/').pop()!;

    // The student joins from a phone with the code, typed in lower case.
    const student = await person('phone', 'Ivo Student');
    const p = student.page;
    await p.goto(`${base}/classes`);
    await p.getByLabel('Join code').fill(code.toLowerCase());
    await p.getByRole('button', { name: 'Join', exact: true }).click();
    // Joining takes them to the class, which says they joined.
    await expect.poll(() => p.getByTestId('joined-notice').textContent().catch(() => null), { timeout: 10_000 }).toBe(`You joined Flash basics ${word}.`);

    await t.getByLabel('New lesson title').fill('Distance decides the background');
    await t.getByRole('button', { name: 'Add the lesson' }).click();
    await expect.poll(() => t.url(), { timeout: 10_000 }).toMatch(/\/lessons\/[0-9a-f-]{36}\/edit$/);
    const lessonId = t.url().split('/').slice(-2)[0]!;
    await t.getByLabel('Find a setup').fill(word);
    await t.getByTestId(`add-Paper falloff ${word}`).click();
    await expect.poll(() => t.getByTestId('lesson-setup-title').count(), { timeout: 10_000 }).toBe(1);
    await t.getByTestId(`add-Rim then key ${word}`).click();
    await expect.poll(() => t.getByTestId('lesson-setup-title').allTextContents(), { timeout: 10_000 }).toEqual([`1. Paper falloff ${word}`, `2. Rim then key ${word}`]);
    // The class will see what each step does; the instructor adds words to one.
    expect(await t.getByText('adding Key: ', { exact: false }).count()).toBeGreaterThanOrEqual(2);
    const stepNote = t.getByLabel('Your words for step 2').first();
    await stepNote.fill('The paper is three metres from the head, the face one: about three stops apart.');
    await stepNote.blur();
    await t.getByRole('button', { name: 'Publish' }).click();
    await expect.poll(() => text(t, 'lesson-state')).toBe('Published: students can follow it');
    await shot(t, 'classes-wide-lesson-builder');

    // Presentation mode on a projector-sized screen: the arrow keys step through.
    await t.goto(`${base}/present/${lessonId}`);
    await t.getByTestId('presentation').waitFor();
    expect(await text(t, 'player-position')).toBe('Setup 1 of 2 · step 1 of 2');
    await t.keyboard.press('ArrowRight');
    await expect.poll(() => text(t, 'player-position')).toBe('Setup 1 of 2 · step 2 of 2');
    expect(await text(t, 'change-line')).toMatch(/^Adding Key: the subject reads f\/[\d.]+ \([+−±]\d\.\d vs the camera\), background −(2\.[5-9]|3\.\d) vs the subject$/);
    expect(await text(t, 'instructor-note')).toContain('three stops apart');
    await shot(t, 'classes-present-step2');
    await t.keyboard.press('ArrowRight');
    await expect.poll(() => text(t, 'player-position')).toBe('Setup 2 of 2 · step 1 of 2');
    await t.keyboard.press('ArrowLeft');
    await expect.poll(() => text(t, 'player-position')).toBe('Setup 1 of 2 · step 2 of 2');
    await t.keyboard.press('Escape');
    await expect.poll(() => t.url()).toBe(`${base}/lessons/${lessonId}`);

    // The assignment, with a check the meter evaluates.
    await t.goto(`${base}/lessons/${lessonId}/edit`);
    await t.getByLabel('Assignment title').fill('One light, paper three stops down');
    await t.getByLabel('Assignment brief').fill('Reproduce the reference with one light; keep the paper at least 2 stops under the face.');
    await t.getByRole('button', { name: 'Add a target' }).click();
    await t.getByLabel('Target 1 highest').fill('-2');
    await t.getByRole('button', { name: 'Add a target' }).click();
    await t.getByRole('radiogroup', { name: 'Target 2 measures' }).getByRole('button', { name: 'Lights on' }).click();
    await t.getByLabel('Target 2 highest').fill('1');
    await t.getByTestId('set-assignment').click();
    await expect.poll(() => t.url(), { timeout: 10_000 }).toMatch(/\/assignments\/[0-9a-f-]{36}$/);
    const assignmentId = t.url().split('/').pop()!;
    await expect.poll(() => t.getByText('Background vs the subject: 2.0 stops or more under the subject').count()).toBe(1);

    // ---- The student follows the lesson on a phone ----
    await p.goto(`${base}/classes/${classId}`);
    await p.getByTestId('lesson-row').filter({ hasText: 'Distance decides the background' }).click();
    await p.getByTestId('player-plan').waitFor();
    // Step 1: the set only; no light yet. Step 2: the key arrives and the meter reads it.
    expect(await text(p, 'player-position')).toBe('Setup 1 of 2 · step 1 of 2');
    expect(await text(p, 'change-line')).toBe('Starting with Grey paper, Sitter and Camera: nothing to meter yet (needs a light)');
    expect(await p.getByTestId('item-key').count()).toBe(0);
    await p.getByRole('button', { name: 'Next step' }).click();
    await expect.poll(() => text(p, 'player-position')).toBe('Setup 1 of 2 · step 2 of 2');
    await expect.poll(() => p.getByTestId('item-key').count()).toBe(1);
    expect(await text(p, 'step-meter-background')).toMatch(/^−(2\.[5-9]|3\.\d)$/);
    await shot(p, 'classes-phone-lesson-step2');
    await p.getByRole('button', { name: 'Next step' }).click();
    await expect.poll(() => text(p, 'player-position')).toBe('Setup 2 of 2 · step 1 of 2');
    expect(await text(p, 'change-line')).toMatch(/^Starting with Rim and the set: /);
    await p.getByRole('button', { name: 'Next step' }).click();
    await expect.poll(() => text(p, 'change-line')).toMatch(/^Adding Key: /);
    await shot(p, 'classes-phone-lesson-setup2');

    // The assignment: start from a copy of the reference (a setup of the student's own).
    await p.goto(`${base}/assignments/${assignmentId}`);
    await p.getByRole('button', { name: 'Start from the reference' }).click();
    await p.getByTestId('open-my-plan').waitFor();
    const mine = (await student.api.get(`/assignments/${assignmentId}`)).mine.setupId as string;
    const copy = await student.api.get(`/setups/${mine}`);
    expect(copy.document.items.map((i: { id: string }) => i.id)).toEqual(['paper', 'sitter', 'cam', 'key']);
    // The student tries a second light (made through the API: drawing it on a phone is the editor's own test).
    const spare = { ...key, id: 'spare', label: 'Second light', x: 2.8, y: 4.2, aimDeg: -45 };
    await student.api.send('PUT', `/setups/${mine}`, { version: copy.version, document: { ...copy.document, items: [...copy.document.items, spare] } });
    await p.reload();
    await expect.poll(() => text(p, 'local-check-verdict'), { timeout: 10_000 }).toBe('Not yet');
    await p.getByTestId('submit-plan').click();
    await expect.poll(() => text(p, 'server-check-verdict'), { timeout: 10_000 }).toBe('Not yet');
    expect(await p.getByTestId('server-check').getByText('Lights on: 2').count()).toBe(1);
    await p.getByTestId('server-check').scrollIntoViewIfNeeded();
    await shot(p, 'classes-phone-submitted-fails');

    // Fix it in the editor: select the second light on the plan and switch it off.
    await p.getByTestId('open-my-plan').click();
    await p.getByTestId('plan').waitFor();
    await expect.poll(() => p.getByTestId('item-spare').count(), { timeout: 10_000 }).toBe(1);
    const at = await centreOf(p, p.getByTestId('item-spare'));
    await p.mouse.click(at.x, at.y);
    await dragSheet(p, true);
    await p.getByRole('tab', { name: 'Item' }).click();
    await p.getByRole('switch', { name: 'On' }).click();
    await expect.poll(() => text(p, 'save-state'), { timeout: 10_000 }).toBe('Saved');
    await shot(p, 'classes-phone-editor-light-off');
    await p.goto(`${base}/assignments/${assignmentId}`);
    await expect.poll(() => text(p, 'local-check-verdict'), { timeout: 10_000 }).toBe('Passes');
    await p.getByTestId('submit-plan').click();
    await expect.poll(() => text(p, 'server-check-verdict'), { timeout: 10_000 }).toBe('Passes');
    expect(await p.getByTestId('submitted').textContent()).toContain('Submitted as attempt 2');
    await p.getByTestId('server-check').scrollIntoViewIfNeeded();
    await shot(p, 'classes-phone-submitted-passes');

    // ---- The instructor reviews: a comment pinned to the key, then reviewed ----
    await t.goto(`${base}/assignments/${assignmentId}`);
    await t.getByTestId('submission-row').filter({ hasText: 'Ivo Student' }).click();
    await t.getByTestId('submission-plan').waitFor();
    expect(await text(t, 'review-check-verdict')).toBe('Passes');
    await expect.poll(() => t.getByTestId('submission-plan').getByTestId('item-key').count(), { timeout: 10_000 }).toBe(1);
    // The review shows the two frames beside the plans (rendered in a worker): wait until the page stops moving,
    // then tap the key where it is now.
    const keyMarker = t.getByTestId('submission-plan').getByTestId('item-key');
    await keyMarker.scrollIntoViewIfNeeded();
    await expect.poll(async () => {
      const a = await centreOf(t, keyMarker);
      await t.waitForTimeout(300);
      const b = await centreOf(t, keyMarker);
      return Math.hypot(a.x - b.x, a.y - b.y);
    }, { timeout: 30_000 }).toBeLessThan(0.5);
    const keyAt = await centreOf(t, keyMarker);
    await t.mouse.click(keyAt.x, keyAt.y);
    await expect.poll(() => text(t, 'pin-target')).toBe('Pinned on Key');
    await t.getByLabel('Your comment').fill('Good: one head, paper well down. Try feathering it a touch left.');
    await t.getByTestId('add-comment').click();
    await expect.poll(() => t.getByTestId('review-comment').count()).toBe(1);
    await t.getByTestId('mark-reviewed').click();
    await expect.poll(() => text(t, 'review-state')).toBe('Reviewed');
    await shot(t, 'classes-wide-review');

    // ---- The student sees the review ----
    await p.goto(`${base}/assignments/${assignmentId}`);
    await p.getByRole('link', { name: /^Attempt 2\b/ }).click();
    await expect.poll(() => text(p, 'review-state'), { timeout: 10_000 }).toBe('Reviewed');
    expect(await p.getByTestId('review-comment').textContent()).toContain('Rowan Teacher · on Key');
    expect(await p.getByText('Try feathering it a touch left.', { exact: false }).count()).toBe(1);
    await p.getByTestId('review-comment').scrollIntoViewIfNeeded();
    await shot(p, 'classes-phone-review-seen');
    // Mail goes out through the queue (server/mail/queue.ts): wait for it.
    const subjects = async () => {
      const mail = (await (await fetch(`${base}/dev/inbox.json`)).json()) as { messages: { to: string[]; subject: string }[] };
      return mail.messages.filter((m) => m.to.includes(student.email)).map((m) => m.subject);
    };
    await expect
      .poll(subjects, { timeout: 20_000 })
      .toEqual(expect.arrayContaining(['New assignment in ' + `Flash basics ${word}: One light, paper three stops down`, 'Your plan for “One light, paper three stops down” was reviewed']));

    expect(teacher.errors).toEqual([]);
    expect(student.errors).toEqual([]);
    await teacher.context.close();
    await student.context.close();
  });
});
