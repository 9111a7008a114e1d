import { useMutation } from '@tanstack/react-query';
import { ApiError, apiErrorFrom, type RigConfiguration } from '@loomwright/shared';
import { shopToday } from 'src/lib/format';

/**
 * POST /api/quotes/pdf answers a PDF, not JSON, so it is fetched as a blob here; a refusal still
 * arrives as JSON words and becomes an ApiError like any other.
 */
export async function downloadQuote(configuration: RigConfiguration): Promise<Blob> {
  let response: Response;
  try {
    response = await fetch('/api/quotes/pdf', {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ configuration }),
    });
  } catch {
    throw new ApiError(0, 'The shop could not be reached; check your connection and try again.');
  }
  if (!response.ok) {
    throw apiErrorFrom(
      response.status,
      await response.json().catch(() => ({ message: `The quote could not be made (HTTP ${response.status}).` })),
    );
  }
  return response.blob();
}

/** Saves the quote as a file the player keeps (and can print). */
export const useDownloadQuote = () =>
  useMutation({
    mutationFn: downloadQuote,
    onSuccess: (blob) => {
      const url = URL.createObjectURL(blob);
      const a = document.createElement('a');
      a.href = url;
      a.download = `loomwright-quote-${shopToday()}.pdf`;
      document.body.append(a);
      a.click();
      a.remove();
      window.setTimeout(() => URL.revokeObjectURL(url), 10_000);
    },
  });
