// The crew sheet panel and the photos panel against a stand-in API behind fetch: what crew and editors are
// offered, the sheet's contents summary, and a result photo's settings beside the meter's prediction.
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactElement } from 'react';
import { CrewSheetPanel } from '../../components/crew/CrewSheetPanel';
import { PhotosPanel, comparison } from '../../components/photos/PhotosPanel';
import { demoSetups } from '../../db/seed-setups';
import type { SetupPhoto, StudioRole } from '../../model/api';

const ORIGIN = 'http://falloff.test';
const SETUP = '0b6f3f0e-7c1a-4d7e-9a55-3c2d1e0f9a11';
type Route = (url: URL, init?: RequestInit) => { status: number; body: unknown } | undefined;

function serve(route: Route) {
  const fetch = vi.fn(async (input: string | URL | Request, init?: RequestInit) => {
    const url = new URL(String(input), ORIGIN);
    const a = route(url, init) ?? { status: 404, body: { error: { code: 'not_found', message: `no ${url.pathname}` } } };
    return new Response(a.status === 204 ? null : JSON.stringify(a.body), { status: a.status, headers: { 'content-type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fetch);
  return fetch;
}

function show(el: ReactElement) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(<QueryClientProvider client={client}>{el}</QueryClientProvider>);
}

const me = { user: { id: 'u1', name: 'Ada', email: 'ada@example.test', units: 'metric', paper: 'letter' }, studios: [], classes: [] };
function setupAs(role: StudioRole) {
  const clamshell = demoSetups.find((s) => s.title.startsWith('Clamshell'))!;
  return { id: SETUP, studioId: 's1', studioName: 'North light', ownerId: 'u1', ownerName: 'Ada', title: 'Clamshell for the partners', notes: '', tags: [], document: clamshell.document, schemaVersion: 1, version: 4, isTemplate: false, createdAt: '2026-11-01T00:00:00Z', updatedAt: '2026-11-02T00:00:00Z', role };
}
const crewRoutes =
  (role: StudioRole): Route =>
  (url) =>
    url.pathname === `/api/setups/${SETUP}` ? { status: 200, body: setupAs(role) } : url.pathname === '/api/me' ? { status: 200, body: me } : url.pathname === `/api/setups/${SETUP}/shares` ? { status: 200, body: { shares: [] } } : undefined;

afterEach(() => vi.unstubAllGlobals());
// The panel reads its setup through the document parser's chunk (components/shareScreen.ts), loaded on demand
// (hooks/setups.ts): load it once here, cold, with time to spare on a loaded machine, so no test waits on it.
beforeAll(async () => {
  await import('../../components/shareScreen');
}, 240_000);

describe('CrewSheetPanel', () => {
  it('shows crew the preview, what the sheet holds and the downloads, but not making links or e-mail', async () => {
    serve(crewRoutes('crew'));
    show(<CrewSheetPanel setupId={SETUP} />);
    expect(await screen.findByText('Crew sheet')).toBeInTheDocument();
    expect(screen.getByText(/1 light and 3 other items in the kit, camera and meter, 2 steps, 2 shots, and the safety notes/)).toBeInTheDocument();
    // The preview is named for assistive tech and shows the plan's image (react-native-web draws it as a
    // background, with an <img> for the browser's own image actions once it is loading).
    const preview = screen.getByTestId('crew-sheet-preview');
    expect(preview).toHaveAttribute('aria-label', expect.stringMatching(/^The plan as printed on the crew sheet: Stage 8\.00 m × 6\.00 m/));
    // react-native-web sets the image's address once its loader has started (a later task on a loaded machine).
    const shown = () => preview.querySelector('img')?.getAttribute('src') ?? /url\("(.*)"\)/.exec(preview.querySelector<HTMLElement>('[style*="background-image"]')?.style.backgroundImage ?? '')?.[1];
    await waitFor(() => expect(shown()).toBe(`/api/setups/${SETUP}/plan.png?width=900&v=4`), { timeout: 5_000 });
    for (const id of ['download-pdf', 'download-png', 'download-svg']) expect(screen.getByTestId(id)).toBeInTheDocument();
    expect(await screen.findByText('No links yet.')).toBeInTheDocument();
    expect(screen.queryByTestId('make-share-link')).toBeNull();
    expect(screen.queryByTestId('send-to-crew')).toBeNull();
    // The account's paper is chosen to start with.
    expect(screen.getByRole('tab', { name: 'US Letter' })).toHaveAttribute('aria-selected', 'true');
  });

  it('lets an editor make a link and shows its address once', async () => {
    const fetch = serve((url, init) =>
      url.pathname === `/api/setups/${SETUP}/shares` && init?.method === 'POST'
        ? { status: 201, body: { token: 'T'.repeat(43), url: `${ORIGIN}/s/${'T'.repeat(43)}`, share: { id: 'sh1', label: 'Grips', tokenTail: 'TTTT', createdAt: '2026-11-03T00:00:00Z', createdBy: 'Ada', lastOpenedAt: null } } }
        : crewRoutes('editor')(url, init),
    );
    show(<CrewSheetPanel setupId={SETUP} />);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Link label'), 'Grips');
    await user.click(screen.getByTestId('make-share-link'));
    expect(await screen.findByTestId('share-url')).toHaveTextContent(`${ORIGIN}/s/${'T'.repeat(43)}`);
    const post = fetch.mock.calls.find(([, i]) => i?.method === 'POST')!;
    expect(JSON.parse(String(post[1]!.body))).toEqual({ label: 'Grips' });
    expect(screen.getByTestId('send-to-crew')).toBeInTheDocument();
  });

  it('checks the addresses before sending, with the shared schema', async () => {
    const fetch = serve(crewRoutes('owner'));
    show(<CrewSheetPanel setupId={SETUP} />);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail addresses'), 'kit@crew.test, not-an-address');
    await user.click(screen.getByTestId('send-to-crew'));
    expect(await screen.findByText('not an e-mail address: not-an-address')).toBeInTheDocument();
    expect(fetch.mock.calls.some(([u]) => String(u).endsWith('/send'))).toBe(false);
  });
});

const photo = (over: Partial<SetupPhoto>): SetupPhoto => ({
  id: 'p1',
  kind: 'result',
  filename: 'IMG_0420.JPG',
  mime: 'image/jpeg',
  bytes: 1000,
  width: 1200,
  height: 800,
  url: `/api/setups/${SETUP}/photos/p1`,
  thumbnailUrl: `/api/setups/${SETUP}/photos/p1/thumbnail`,
  exif: { iso: 200, aperture: 8, shutterS: 1 / 160, focalMm: 85, camera: 'Bench Camera', takenAt: null },
  uploadedBy: { id: 'u1', name: 'Ada' },
  createdAt: '2026-11-03T00:00:00Z',
  notes: [],
  ...over,
});

describe('PhotosPanel', () => {
  it('shows a result photo’s settings from EXIF beside the meter’s prediction', async () => {
    serve((url) => (url.pathname === `/api/setups/${SETUP}/photos` ? { status: 200, body: { photos: [photo({}), photo({ id: 'p2', kind: 'reference', filename: 'set.heic', mime: 'image/heic', thumbnailUrl: null, exif: { iso: null, aperture: null, shutterS: null, focalMm: null, camera: null, takenAt: null }, notes: ['No preview: this server cannot decode HEIC. The original is kept; download it to view.'] })] } } : undefined));
    show(<PhotosPanel setupId={SETUP} predictedAperture={7.1} />);
    const settings = await screen.findAllByTestId('photo-settings');
    expect(settings[0]).toHaveTextContent('f/8 · 1/160 · ISO 200 · 85 mm');
    expect(screen.getByTestId('photo-comparison')).toHaveTextContent('The photo was shot at f/8; the plan predicts f/7.1 at the subject (0.3 stops narrower).');
    expect(settings[1]).toHaveTextContent('no camera settings in the file');
    expect(screen.getByText(/cannot decode HEIC/)).toBeInTheDocument();
    expect(screen.getAllByTestId('photo-comparison')).toHaveLength(1); // references are not compared
  });

  it.each([
    [8, 8, 'the same within a sixth of a stop'],
    [5.6, 8, '1.0 stop wider'],
    [16, 8, '2.0 stops narrower'],
  ])('compares f/%s with a prediction of f/%s: %s (stops = 2·log2(N1/N0))', (shot, predicted, words) => {
    expect(comparison(shot, predicted)).toContain(`(${words})`);
  });

  it('says nothing to compare without an aperture or a prediction', () => {
    expect(comparison(null, 8)).toBeNull();
    expect(comparison(8, null)).toBeNull();
  });
});
