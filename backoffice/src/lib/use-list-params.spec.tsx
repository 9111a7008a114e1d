import { act, cleanup, render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, describe, expect, it } from 'vitest';
import { useListParams } from './use-list-params';

type Handle = ReturnType<typeof useListParams<'q' | 'open'>>;

function mount(url: string) {
  const handle: { current?: Handle } = {};
  function Probe() {
    handle.current = useListParams({ sort: 'created_at', order: 'desc', filters: { q: '', open: '' } });
    return null;
  }
  const router = createMemoryRouter([{ path: '/requests', element: <Probe /> }], { initialEntries: [url] });
  render(<RouterProvider router={router} />);
  return { handle, router };
}

afterEach(cleanup);

describe('useListParams', () => {
  it('keeps both of two changes made before the address bar catches up (a row opened as the search fires)', async () => {
    const { handle, router } = mount('/requests?page=2');
    await act(async () => {
      handle.current!.update({ filters: { open: 'b-1' }, page: 2 });
      handle.current!.update({ filters: { q: 'Marlo' } });
    });
    const search = new URLSearchParams(router.state.location.search);
    expect(search.get('open')).toBe('b-1');
    expect(search.get('q')).toBe('Marlo');
    // A new search goes back to the first page.
    expect(search.get('page')).toBeNull();
    expect(handle.current!.params.filters).toEqual({ q: 'Marlo', open: 'b-1' });
  });

  it('starts from a page the browser went back to, not from a change made before it', async () => {
    const { handle, router } = mount('/requests');
    await act(async () => handle.current!.update({ filters: { q: 'Marlo' } }));
    await act(async () => {
      await router.navigate('/requests?q=Wren');
    });
    await act(async () => handle.current!.update({ filters: { open: 'b-2' } }));
    const search = new URLSearchParams(router.state.location.search);
    expect(search.get('q')).toBe('Wren');
    expect(search.get('open')).toBe('b-2');
  });

  it('sorts a new column its natural way first and flips the same column', async () => {
    const { handle } = mount('/requests');
    await act(async () => handle.current!.toggleSort('reference'));
    expect(handle.current!.params).toMatchObject({ sort: 'reference', order: 'asc' });
    await act(async () => handle.current!.toggleSort('reference'));
    expect(handle.current!.params).toMatchObject({ sort: 'reference', order: 'desc' });
  });
});
