import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { Link, MemoryRouter, Route, Routes } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { RouteErrorBoundary } from './RouteError';

function Broken(): never {
  throw new Error('The build list could not be read.');
}

describe('a page that fails', () => {
  afterEach(() => {
    cleanup();
    vi.restoreAllMocks();
  });

  it('shows the error screen with its message, and a link to another page leaves it', () => {
    // React logs the caught error; keep the test output readable.
    vi.spyOn(console, 'error').mockImplementation(() => {});
    render(
      <MemoryRouter initialEntries={['/broken']}>
        <RouteErrorBoundary>
          <Routes>
            <Route path="/broken" element={<Broken />} />
            <Route path="/fine" element={<p>a page that works</p>} />
          </Routes>
        </RouteErrorBoundary>
        <Link to="/fine">elsewhere</Link>
      </MemoryRouter>,
    );
    expect(screen.getByRole('heading', { name: 'This page could not be shown' })).toBeTruthy();
    expect(screen.getByText(/The build list could not be read\./)).toBeTruthy();
    fireEvent.click(screen.getByRole('link', { name: 'elsewhere' }));
    expect(screen.getByText('a page that works')).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'This page could not be shown' })).toBeNull();
  });
});
