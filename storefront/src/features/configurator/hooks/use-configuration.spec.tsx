import { act, cleanup, render } from '@testing-library/react';
import { useState } from 'react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { decodeConfiguration, demoPriceBook, encodeConfiguration, type Catalog } from '@loomwright/shared';
import { useConfiguration } from './use-configuration';

const catalog: Catalog = { ...demoPriceBook, priceBookVersion: 1, publishedAt: '2026-12-01T00:00:00Z' };
type Handle = ReturnType<typeof useConfiguration>;

function mount(url: string) {
  const handle: { current?: Handle } = {};
  function Probe() {
    handle.current = useConfiguration(catalog);
    return null;
  }
  const router = createMemoryRouter([{ path: '/configure', element: <Probe /> }], { initialEntries: [url] });
  render(<RouterProvider router={router} />);
  const inUrl = () => decodeConfiguration(new URLSearchParams(router.state.location.search).get('c'));
  return { handle, router, inUrl };
}

beforeEach(() => window.localStorage.clear());
afterEach(cleanup);

describe('useConfiguration', () => {
  it('keeps every one of several changes made before the address bar catches up', async () => {
    const { handle, inUrl } = mount('/configure?step=routing');
    await act(async () => {
      handle.current!.update((c) => ({ ...c, routing: { mode: 'switcher' } }));
      handle.current!.update((c) => ({ ...c, functions: [...c.functions, 'stereo_output'] }));
      handle.current!.update((c) => ({ ...c, level: 'master' }));
      handle.current!.goToStep('extras');
    });
    expect(handle.current!.configuration).toMatchObject({ routing: { mode: 'switcher' }, functions: ['stereo_output'], level: 'master' });
    expect(inUrl()).toMatchObject({ routing: { mode: 'switcher' }, functions: ['stereo_output'], level: 'master' });
    expect(handle.current!.step).toBe('extras');
  });

  it("leaves a fresh board's address bare until something is entered", async () => {
    const { handle, router, inUrl } = mount('/configure');
    expect(router.state.location.search).toBe('');
    await act(async () => handle.current!.update((c) => ({ ...c, pedalCount: 5 })));
    expect(inUrl()?.pedalCount).toBe(5);
  });

  it("walks back a step with the browser's Back and keeps what was entered on the later step", async () => {
    const { handle, router, inUrl } = mount('/configure?step=case');
    await act(async () => handle.current!.goToStep('pedals'));
    await act(async () => handle.current!.update((c) => ({ ...c, pedalCount: 11 })));
    await act(async () => {
      await router.navigate(-1);
    });
    expect(handle.current!.step).toBe('case');
    expect(handle.current!.configuration!.pedalCount).toBe(11);
    expect(inUrl()?.pedalCount).toBe(11);
  });

  it('takes the configuration of a link followed on the page', async () => {
    const { handle, router } = mount('/configure?step=pedals');
    const shared = encodeConfiguration({ ...handle.current!.configuration!, pedalCount: 4, level: 'journeyman' });
    await act(async () => {
      await router.navigate(`/configure?step=review&c=${shared}`);
    });
    expect(handle.current!.configuration).toMatchObject({ pedalCount: 4, level: 'journeyman' });
    expect(handle.current!.step).toBe('review');
  });

  it('restores the draft of a closed tab and forgets it on Start over', async () => {
    const first = mount('/configure');
    await act(async () => first.handle.current!.update((c) => ({ ...c, pedalCount: 9 })));
    cleanup();
    const second = mount('/configure');
    expect(second.handle.current!.configuration!.pedalCount).toBe(9);
    expect(second.handle.current!.restoredFrom).not.toBeNull();
    await act(async () => second.handle.current!.startOver());
    cleanup();
    const third = mount('/configure');
    expect(third.handle.current!.restoredFrom).toBeNull();
    // Start over is a clean sheet: no pedals the player did not enter.
    expect(third.handle.current!.configuration!.pedalCount).toBeUndefined();
    expect(third.handle.current!.configuration!.surfaceId).toBe('');
  });

  it('shows its frame until the price book arrives, then opens the draft this browser kept', async () => {
    const first = mount('/configure');
    await act(async () => first.handle.current!.update((c) => ({ ...c, pedalCount: 7 })));
    cleanup();

    const handle: { current?: Handle } = {};
    let priceBookArrives!: (book: Catalog) => void;
    function Probe() {
      const [book, setBook] = useState<Catalog>();
      priceBookArrives = setBook;
      handle.current = useConfiguration(book);
      return null;
    }
    const router = createMemoryRouter([{ path: '/configure', element: <Probe /> }], { initialEntries: ['/configure'] });
    render(<RouterProvider router={router} />);
    expect(handle.current!.configuration).toBeUndefined();
    // The frame's step bar moves between steps; nothing else is written before there is a board.
    await act(async () => handle.current!.goToStep('case'));
    expect(router.state.location.search).toBe('?step=case');

    await act(async () => priceBookArrives(catalog));
    expect(handle.current!.configuration!.pedalCount).toBe(7);
    expect(handle.current!.restoredFrom).not.toBeNull();
    expect(handle.current!.step).toBe('case');
  });
});
