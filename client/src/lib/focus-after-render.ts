import { useCallback, useEffect, useRef, useState, type RefObject } from 'react';

/**
 * A ref and a request to focus its element after the next render, for a notice that appears
 * with an error or an outcome: focus moves there so screen readers announce it and keyboard
 * users start there. Requested in the same update that shows the notice, it runs once React has
 * drawn it (a frame requested with the error could run before that on a loaded machine).
 */
export function useFocusAfterRender<T extends HTMLElement>(): { ref: RefObject<T | null>; requestFocus: () => void } {
  const ref = useRef<T | null>(null);
  const [requests, setRequests] = useState(0);
  useEffect(() => {
    if (requests > 0) ref.current?.focus();
  }, [requests]);
  const requestFocus = useCallback(() => setRequests((n) => n + 1), []);
  return { ref, requestFocus };
}
