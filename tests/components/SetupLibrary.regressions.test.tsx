// The library asks for the order the user picked, and a delete the server refuses puts the setup back.
import { QueryClient, QueryClientProvider, type InfiniteData } from '@tanstack/react-query';
import { act, renderHook, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import type { ReactNode } from 'react';
import { SetupLibrary } from '../../components/SetupLibrary';
import { setupKeys, useDeleteSetup } from '../../hooks/setups';
import type { SetupListResponse } from '../../model/api';
import { ORIGIN, renderScreen, serveApi, setup } from './support/library';

afterEach(() => {
  vi.unstubAllGlobals();
});

describe('SetupLibrary sort', () => {
  it('asks the server for the order picked (A–Z sends sort=title)', async () => {
    const api = serveApi(() => ({ status: 200, body: { setups: [setup({ title: 'Clamshell portrait' })], nextCursor: null } }));
    const user = userEvent.setup();
    renderScreen(<SetupLibrary />);
    expect(await screen.findByText('Clamshell portrait')).toBeInTheDocument();
    expect(api.listRequests().every((u) => !u.searchParams.has('sort'))).toBe(true);

    // Wide: a "Sort by" tab row; phone: one chip that steps Recent → Newest → A–Z.
    const tab = screen.queryByRole('tab', { name: 'A–Z' });
    if (tab) await user.click(tab);
    else {
      await user.click(screen.getByRole('button', { name: 'Sort: Recent' }));
      await user.click(screen.getByRole('button', { name: 'Sort: Newest' }));
    }
    await waitFor(() => expect(api.listRequests().some((u) => u.searchParams.get('sort') === 'title')).toBe(true));
  });
});

describe('deleting a setup', () => {
  it('takes it out of the list at once and puts it back when the server refuses', async () => {
    const kept = setup({ id: '11111111-1111-4111-8111-111111111111', title: 'Kept' });
    const doomed = setup({ id: '22222222-2222-4222-8222-222222222222', title: 'Doomed' });
    let answer!: (r: Response) => void;
    const fetch = vi.fn((input: string | URL | Request, init?: RequestInit) => {
      expect(init?.method).toBe('DELETE');
      expect(new URL(String(input), ORIGIN).pathname).toBe(`/api/setups/${doomed.id}`);
      return new Promise<Response>((resolve) => (answer = resolve));
    });
    vi.stubGlobal('fetch', fetch);

    const qc = new QueryClient({ defaultOptions: { queries: { retry: false, gcTime: Infinity }, mutations: { retry: false } } });
    const key = setupKeys.list({});
    qc.setQueryData<InfiniteData<SetupListResponse>>(key, { pages: [{ setups: [kept, doomed], nextCursor: null }], pageParams: [null] });
    const titles = () => qc.getQueryData<InfiniteData<SetupListResponse>>(key)!.pages.flatMap((p) => p.setups.map((s) => s.title));
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={qc}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useDeleteSetup(), { wrapper });

    act(() => result.current.mutate(doomed.id));
    await waitFor(() => expect(titles()).toEqual(['Kept']));
    expect(fetch).toHaveBeenCalledTimes(1);

    await act(async () => answer(new Response(JSON.stringify({ error: { code: 'internal', message: 'database unavailable' } }), { status: 503 })));
    await waitFor(() => expect(result.current.isError).toBe(true));
    expect(titles()).toEqual(['Kept', 'Doomed']);
  });
});
