import { useRef } from 'react';
import { isRetryable } from './api-client';

/**
 * Gives one act of signing an id and sends it with every try, so a resend after a lost answer, or a double tap, is
 * answered by the server as the first try and never signs twice. The id is kept while the outcome is unknown (no
 * answer, or a 5xx) and renewed once the server has answered for sure: stored, or refused with nothing stored.
 */
export function useSignOnce<I, O>(
  act: (input: I, requestId: string) => Promise<O>,
): (input: I) => Promise<O> {
  const id = useRef<string | null>(null);
  return async (input: I) => {
    const requestId = (id.current ??= crypto.randomUUID());
    try {
      const answer = await act(input, requestId);
      id.current = null;
      return answer;
    } catch (error) {
      if (!isRetryable(error)) id.current = null;
      throw error;
    }
  };
}
